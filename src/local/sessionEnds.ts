import type { Table } from 'dexie';
import { endsOfRound } from '../core';
import { cardKeyOf, endKeyOf, type LocalDb, type OutboxRow, type OutboxStatus } from './db';
import { localEnd, type LocalEnd } from './endFacts';
import type { JoinedTarget } from './db';

function groupBy<T>(rows: T[], key: (row: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const row of rows) map.set(key(row), [...(map.get(key(row)) ?? []), row]);
  return map;
}

/** From this many archers on, the session's rows are read whole (a few targets' pads read per archer). */
const WHOLE_SESSION_FROM = 16;

/**
 * The ends built on earlier reads, by end key, with the inputs each was built from: an end whose
 * rows read the same is handed back as the same object, so a screen redraws only the ends a
 * change touched (a tap changes one end; every end is read again after it).
 */
export type EndCache = Map<string, { inputs: string; end: LocalEnd }>;

function reused(
  cache: EndCache | undefined,
  key: string,
  inputs: unknown[],
  build: () => LocalEnd,
): LocalEnd {
  if (!cache) return build();
  const read = JSON.stringify(inputs);
  const hit = cache.get(key);
  if (hit?.inputs === read) return hit.end;
  const end = build();
  cache.set(key, { inputs: read, end });
  return end;
}

/**
 * Every end of the given targets' archers as this phone knows it: the server's records, the
 * judges' records, and this person's waiting changes on top. Also this person's refused changes,
 * and those the server holds for a judge (they arrived after the session closed), and the
 * number of this person's changes on these targets not sent yet.
 */
export async function loadSessionEnds(
  db: LocalDb,
  sessionId: number,
  userId: number,
  targets: JoinedTarget[],
  cache?: EndCache,
): Promise<{ ends: Map<string, LocalEnd>; rejected: OutboxRow[]; held: OutboxRow[]; unsent: number }> {
  // Only these targets' ends are read: a writer's pad must not slow down as the whole field fills up.
  const endKeys = targets.flatMap((target) =>
    target.archers.flatMap((archer) =>
      endsOfRound(archer.round).map((end) => endKeyOf(sessionId, archer.entryId, end.index)),
    ),
  );
  const wanted = new Set(endKeys);
  // One range per archer ("session:entry:" prefix), read whole: a cursor hopping between many
  // keys costs a round trip to the browser's database process per key, on every tap.
  const prefixes = [
    ...new Set(targets.flatMap((t) => t.archers.map((a) => `${cardKeyOf(sessionId, a.entryId)}:`))),
  ];
  // Many archers (the judge desk's whole session): one read of the session beats a range per archer.
  const wholeSession = prefixes.length > WHOLE_SESSION_FROM;
  const byArcher = <T, K, I>(table: Table<T, K, I>) =>
    wholeSession
      ? table.where('sessionId').equals(sessionId).toArray()
      : Promise.all(prefixes.map((p) => table.where('endKey').between(p, `${p}\uffff`).toArray())).then(
          (parts) => parts.flat(),
        );
  // Writer records are kept one row per card (see CardRecordsRow).
  const cardRecords = () =>
    (wholeSession
      ? db.cardRecords.where('sessionId').equals(sessionId).toArray()
      : db.cardRecords.bulkGet(targets.flatMap((t) => t.archers.map((a) => cardKeyOf(sessionId, a.entryId))))
    ).then((cards) => cards.flatMap((card) => card?.records ?? []));
  // Only unsynced and refused changes matter here; delivered ones are in the server's copies.
  const unsynced = (status: OutboxStatus) =>
    db.outbox
      .where('status')
      .equals(status)
      .toArray()
      .then((rows) =>
        rows.filter((r) => r.userId === userId && prefixes.some((p) => r.endKey.startsWith(p))),
      );
  const [records, settlements, unsent, heldHere, rejectedHere, rulings, signatures] = await db.transaction(
    'r',
    [db.cardRecords, db.settlements, db.outbox, db.rulings, db.endSignatures],
    () =>
      Promise.all([
        cardRecords(),
        byArcher(db.settlements),
        unsynced('pending'),
        unsynced('held'),
        unsynced('rejected'),
        byArcher(db.rulings),
        byArcher(db.endSignatures),
      ]),
  );
  // Card signatures (session:entry:card) count as unsent but belong to no end.
  const ofEnds = (rows: OutboxRow[]) => rows.filter((r) => wanted.has(r.endKey));
  const [pending, held, rejected] = [ofEnds(unsent), ofEnds(heldHere), ofEnds(rejectedHere)];
  const recordsByEnd = groupBy(records, (r) => endKeyOf(r.sessionId, r.entryId, r.endIndex));
  const settlementByEnd = new Map(settlements.map((s) => [s.endKey, s]));
  const rulingsByEnd = groupBy(rulings, (r) => r.endKey);
  const signaturesByEnd = groupBy(signatures, (r) => r.endKey);
  const waitingByEnd = groupBy([...pending, ...held], (m) => m.endKey);
  const ends = new Map<string, LocalEnd>();
  for (const key of endKeys) {
    const records = recordsByEnd.get(key) ?? [];
    const settlement = settlementByEnd.get(key);
    const waiting = waitingByEnd.get(key) ?? [];
    const judged = { rulings: rulingsByEnd.get(key) ?? [], signatures: signaturesByEnd.get(key) ?? [] };
    ends.set(
      key,
      reused(cache, key, [records, settlement, waiting, judged], () =>
        localEnd(records, settlement, waiting, judged),
      ),
    );
  }
  return { ends, rejected, held, unsent: unsent.length };
}
