import type { ChangeDto, PullQuery, PullResponse } from '../../../src/contract/sync';
import type { Db } from '../../db';

type ChangeRow = { version: number; type: ChangeDto['type']; record_json: string };

/**
 * The changes after `cursor` this person may see, oldest first: those of the target groups they
 * are in, every change of the events they judge or organize, and their own practice.
 *
 * Each of these is read on its own by its index (`session_id, target_number, version` and
 * `event_id, version`), at most one page each, and the pages merged: a pull reads only what the
 * phone may see, so its cost does not grow with the rest of the database (a scan of the whole
 * log with a per-row check did).
 *
 * The page is read up to the newest version at the start (`top`), and when nothing more is
 * waiting the new cursor is `top`, so the next pull starts after everything already looked at,
 * visible or not. What becomes visible later (joining another target) is older than that
 * cursor: a phone pulls from 0 after joining a target (records replace by key, so repeats are
 * harmless).
 */
export async function pullChanges(db: Db, userId: number, query: PullQuery): Promise<PullResponse> {
  const topRow = (await db('changes').max({ top: 'version' }).first()) as { top: number | null } | undefined;
  const top = Number(topRow?.top ?? 0);
  const [events, targets] = await Promise.all([
    db('event_roles')
      .where({ user_id: userId })
      .whereIn('role', ['organizer', 'judge'])
      .distinct('event_id') as Promise<{ event_id: number }[]>,
    db('target_members').where({ user_id: userId }).select('session_id', 'target_number') as Promise<
      { session_id: number; target_number: number }[]
    >,
  ]);

  const page = (narrow: Record<string, number>) =>
    db('changes')
      .where(narrow)
      .where('version', '>', query.cursor)
      .where('version', '<=', top)
      .orderBy('version')
      .limit(query.limit + 1)
      .select('version', 'type', 'record_json') as Promise<ChangeRow[]>;
  const pages = await Promise.all([
    ...events.map((e) => page({ event_id: e.event_id })),
    ...targets.map((t) => page({ session_id: t.session_id, target_number: t.target_number })),
    // The person's own practice (migration 0014): only ever in their own pull.
    page({ user_id: userId }),
  ]);
  // A target of an event the person also judges is in two pages: each change once.
  const merged = new Map<number, ChangeRow>();
  for (const row of pages.flat()) merged.set(row.version, row);
  const rows = [...merged.values()].sort((a, b) => a.version - b.version).slice(0, query.limit + 1);

  const hasMore = rows.length > query.limit;
  const shown = hasMore ? rows.slice(0, query.limit) : rows;
  const changes = shown.map(
    (r) => ({ version: r.version, type: r.type, record: JSON.parse(r.record_json) }) as ChangeDto,
  );
  // A server restored from an older copy has a lower top than the phone's cursor: the phone follows the server.
  return { changes, cursor: hasMore ? shown[shown.length - 1]!.version : top, hasMore };
}
