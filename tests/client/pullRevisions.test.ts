import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { LocalDb } from '../../src/local/db';
import { syncOnce, type SyncTransport } from '../../src/local/syncEngine';
import type { ChangeDto, EndRecordDto } from '../../src/contract/sync';

let n = 0;
const dbs: LocalDb[] = [];
afterEach(async () => {
  for (const db of dbs.splice(0)) await db.delete();
});
function freshDb(): LocalDb {
  n += 1;
  const db = new LocalDb(`pull-revisions-test-${n}`);
  dbs.push(db);
  return db;
}

const record = (revision: number, arrows: EndRecordDto['arrows']): EndRecordDto => ({
  sessionId: 1,
  entryId: 7,
  endIndex: 0,
  slot: 1,
  arrows,
  flags: [],
  revision,
  writtenBy: 5,
  writtenAt: '2026-06-01T09:00:00.000Z',
});

/** A server that has nothing to take and answers each pull with the next prepared page. */
function pages(...all: ChangeDto[][]): SyncTransport {
  let next = 0;
  return {
    push: async () => ({ results: [], lastSeq: 0 }),
    pull: async (cursor) => {
      const changes = all[next] ?? [];
      next += 1;
      return { changes, cursor: cursor + changes.length, hasMore: false };
    },
  };
}

const storedArrows = async (db: LocalDb) =>
  (await db.cardRecords.toArray()).flatMap((c) => c.records.map((r) => [r.revision, r.arrows]));

describe('pulled writer records', () => {
  it('keep the newest revision when one pull carries an older one after it', async () => {
    const db = freshDb();
    await syncOnce(
      db,
      5,
      pages([
        { version: 1, type: 'end', record: record(3, ['X', '9', '9']) },
        { version: 2, type: 'end', record: record(2, ['X', '9']) },
      ]),
    );
    expect(await storedArrows(db)).toEqual([[3, ['X', '9', '9']]]);
  });

  it('never let a later pull with an older revision replace what the phone holds', async () => {
    const db = freshDb();
    const transport = pages(
      [{ version: 1, type: 'end', record: record(3, ['X', '9', '9']) }],
      [{ version: 2, type: 'end', record: record(2, ['X', '9']) }],
    );
    await syncOnce(db, 5, transport);
    await syncOnce(db, 5, transport);
    expect(await storedArrows(db)).toEqual([[3, ['X', '9', '9']]]);
  });

  it('take a newer revision', async () => {
    const db = freshDb();
    const transport = pages(
      [{ version: 1, type: 'end', record: record(2, ['X', '9']) }],
      [{ version: 2, type: 'end', record: record(3, ['X', '9', '8']) }],
    );
    await syncOnce(db, 5, transport);
    await syncOnce(db, 5, transport);
    expect(await storedArrows(db)).toEqual([[3, ['X', '9', '8']]]);
  });
});
