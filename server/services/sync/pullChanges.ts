import type { ChangeDto, PullQuery, PullResponse } from '../../../src/contract/sync';
import type { Db } from '../../db';

/**
 * The changes after `cursor` this person may see, oldest first: those of the target groups they
 * are in, and every change of the events they judge or organize.
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

  const rows = (await db('changes')
    .where('version', '>', query.cursor)
    .where('version', '<=', top)
    .where((visible) =>
      visible
        .whereIn(
          'event_id',
          db('event_roles')
            .where({ user_id: userId })
            .whereIn('role', ['organizer', 'judge'])
            .select('event_id'),
        )
        .orWhereExists(
          db('target_members as tm')
            .where('tm.user_id', userId)
            .where('tm.session_id', db.ref('changes.session_id'))
            .where('tm.target_number', db.ref('changes.target_number'))
            .select('tm.id'),
        ),
    )
    .orderBy('version')
    .limit(query.limit + 1)
    .select('version', 'type', 'record_json')) as {
    version: number;
    type: ChangeDto['type'];
    record_json: string;
  }[];

  const hasMore = rows.length > query.limit;
  const page = hasMore ? rows.slice(0, query.limit) : rows;
  const changes = page.map(
    (r) => ({ version: r.version, type: r.type, record: JSON.parse(r.record_json) }) as ChangeDto,
  );
  // A server restored from an older copy has a lower top than the phone's cursor: the phone follows the server.
  return { changes, cursor: hasMore ? page[page.length - 1]!.version : top, hasMore };
}
