import Database from 'better-sqlite3';
import type { BenchField } from './syncField';

/** One day's change rows as the pad sent them before the server wrote one change per record per commit. */
const CHANGES_PER_DAY = 28_800;

/**
 * `days` earlier days of other sessions (other events) in the change log, written before today's
 * day: what a server that has run a season holds. Nobody of `field` may see them.
 */
export function addEarlierDays(file: string, field: BenchField, days: number): void {
  if (days <= 0) return;
  const db = new Database(file);
  const insert = db.prepare(
    'insert into changes (event_id, session_id, target_number, type, record_json) values (?, ?, ?, ?, ?)',
  );
  db.transaction(() => {
    for (let d = 1; d <= days; d += 1) {
      for (let i = 0; i < CHANGES_PER_DAY; i += 1) {
        const record = {
          sessionId: field.sessionId + 1000 + d,
          entryId: 100_000 + (i % 200),
          endIndex: i % 12,
          slot: 1 + (i % 2),
          arrows: ['X', '10', '9', '9', '8', '7'].slice(0, 1 + (i % 6)),
          flags: [],
          revision: 1 + (i % 6),
          writtenBy: 100_000,
          writtenAt: '2026-11-01T10:00:00.000Z',
        };
        insert.run(field.eventId + 1000 + d, record.sessionId, 1 + (i % 50), 'end', JSON.stringify(record));
      }
    }
  })();
  db.close();
}
