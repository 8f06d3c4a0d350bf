import type { ChangeDto, PullQuery, PullResponse } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { compiledQuery } from '../../compiledQuery';

type ChangeRow = { version: number; type: ChangeDto['type']; record_json: string };

/** One person's pull: the changes after `cursor` they may see, at most `limit`. */
export type PullAsk = PullQuery & { userId: number };

/**
 * The changes after `cursor` this person may see, oldest first: those of the target groups they
 * are in, every change of the events they judge or organize, and their own practice (see `pullMany`).
 */
export async function pullChanges(db: Db, userId: number, query: PullQuery): Promise<PullResponse> {
  return (await pullMany(db, [{ userId, ...query }]))[0]!;
}

/**
 * The pulls of several people at once (the pushes of one commit that asked for theirs): who may
 * see what is read in one query for all of them, then each target's and event's page by its
 * own index (`session_id, target_number, version` and `event_id, version`), at most one page
 * each, and the pages merged per person. A pull reads only what the phone may see, so its cost
 * does not grow with the rest of the database (a scan of the whole log with a per-row check
 * did). A page two people ask for with the same cursor (the two writers of a target) is read once.
 *
 * Each page is read up to the newest version at the start (`top`), and when nothing more is
 * waiting the new cursor is `top`, so the next pull starts after everything already looked at,
 * visible or not. What becomes visible later (joining another target) is older than that
 * cursor: a phone pulls from 0 after joining a target (records replace by key, so repeats are
 * harmless).
 */
export async function pullMany(db: Db, asks: readonly PullAsk[]): Promise<PullResponse[]> {
  if (asks.length === 0) return [];
  const topRow = (await db('changes').max({ top: 'version' }).first()) as { top: number | null } | undefined;
  const top = Number(topRow?.top ?? 0);
  const parts = await visibleParts(db, [...new Set(asks.map((a) => a.userId))]);

  const pages = new Map<string, Promise<ChangeRow[]>>();
  const page = (part: Part, cursor: number, limit: number) => {
    const key = `${part.key}|${cursor}|${limit}`;
    let rows = pages.get(key);
    if (!rows) {
      rows =
        'eventId' in part
          ? eventPage(db, [part.eventId, cursor, top, limit + 1])
          : 'userId' in part
            ? part.last > cursor
              ? userPage(db, [part.userId, cursor, top, limit + 1])
              : Promise.resolve([])
            : targetPage(db, [part.sessionId, part.targetNumber, cursor, top, limit + 1]);
      pages.set(key, rows);
    }
    return rows;
  };

  return Promise.all(
    asks.map(async ({ userId, cursor, limit }) => {
      const read = await Promise.all((parts.get(userId) ?? []).map((part) => page(part, cursor, limit)));
      // A target of an event the person also judges is in two pages: each change once.
      const merged = new Map<number, ChangeRow>();
      for (const row of read.flat()) merged.set(row.version, row);
      const rows = [...merged.values()].sort((a, b) => a.version - b.version).slice(0, limit + 1);

      const hasMore = rows.length > limit;
      const shown = hasMore ? rows.slice(0, limit) : rows;
      const changes = shown.map(
        (r) => ({ version: r.version, type: r.type, record: JSON.parse(r.record_json) }) as ChangeDto,
      );
      // A server restored from an older copy has a lower top than the phone's cursor: the phone follows the server.
      return { changes, cursor: hasMore ? shown[shown.length - 1]!.version : top, hasMore };
    }),
  );
}

/** A part of the log one index reads: an event's changes, or a target group's. */
type Part = { key: string } & (
  { eventId: number } | { userId: number; last: number } | { sessionId: number; targetNumber: number }
);

/** One page of a part after a cursor, up to `top`, at most `limit` rows, by the part's index. */
const pageOf = (db: Db, narrow: Record<string, number>, [cursor, top, limit]: number[]) =>
  db('changes')
    .where(narrow)
    .where('version', '>', cursor!)
    .where('version', '<=', top!)
    .orderBy('version')
    .limit(limit!)
    .select('version', 'type', 'record_json');
const eventPage = compiledQuery<ChangeRow>(4, (db, [eventId, ...rest]) =>
  pageOf(db, { event_id: eventId! }, rest),
);
const userPage = compiledQuery<ChangeRow>(4, (db, [userId, ...rest]) =>
  pageOf(db, { user_id: userId! }, rest),
);
const targetPage = compiledQuery<ChangeRow>(5, (db, [sessionId, targetNumber, ...rest]) =>
  pageOf(db, { session_id: sessionId!, target_number: targetNumber! }, rest),
);

/** What each person may see: the events they judge or organize, and the target groups they are in. */
async function visibleParts(db: Db, userIds: number[]): Promise<Map<number, Part[]>> {
  const [events, targets, practice] = await Promise.all([
    db('event_roles')
      .whereIn('user_id', userIds)
      .whereIn('role', ['organizer', 'judge'])
      .distinct('user_id', 'event_id') as Promise<{ user_id: number; event_id: number }[]>,
    db('target_members')
      .whereIn('user_id', userIds)
      .select('user_id', 'session_id', 'target_number') as Promise<
      { user_id: number; session_id: number; target_number: number }[]
    >,
    // Most people have no practice in the log: their practice page is not read at all.
    db('changes')
      .whereIn('user_id', userIds)
      .groupBy('user_id')
      .select('user_id')
      .max({ last: 'version' }) as Promise<{ user_id: number; last: number }[]>,
  ]);
  const parts = new Map<number, Part[]>();
  const add = (userId: number, part: Part) => {
    const list = parts.get(userId);
    if (list) list.push(part);
    else parts.set(userId, [part]);
  };
  for (const e of events) add(e.user_id, { key: `e${e.event_id}`, eventId: e.event_id });
  for (const t of targets)
    add(t.user_id, {
      key: `t${t.session_id}:${t.target_number}`,
      sessionId: t.session_id,
      targetNumber: t.target_number,
    });
  // The person's own practice (migration 0014): only ever in their own pull.
  for (const p of practice) add(p.user_id, { key: `u${p.user_id}`, userId: p.user_id, last: p.last });
  return parts;
}
