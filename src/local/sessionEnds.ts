import { endKeyOf, type LocalDb, type OutboxRow } from './db';
import { localEnd, type LocalEnd } from './endFacts';
import type { JoinedTarget } from './db';

function groupBy<T>(rows: T[], key: (row: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const row of rows) map.set(key(row), [...(map.get(key(row)) ?? []), row]);
  return map;
}

/**
 * Every end of the given targets' archers as this phone knows it: the server's records, the
 * judges' records, and this person's waiting changes on top. Also this person's refused changes.
 */
export async function loadSessionEnds(
  db: LocalDb,
  sessionId: number,
  userId: number,
  targets: JoinedTarget[],
): Promise<{ ends: Map<string, LocalEnd>; rejected: OutboxRow[] }> {
  // Only these targets' ends are read: a writer's pad must not slow down as the whole field fills up.
  const endKeys = targets.flatMap((target) =>
    target.archers.flatMap((archer) => {
      const endCount = archer.round.distances.reduce((n, d) => n + d.arrows / d.arrowsPerEnd, 0);
      return Array.from({ length: endCount }, (_, endIndex) => endKeyOf(sessionId, archer.entryId, endIndex));
    }),
  );
  const [records, settlements, mine, rulings, signatures] = await Promise.all([
    db.endRecords.where('endKey').anyOf(endKeys).toArray(),
    db.settlements.where('endKey').anyOf(endKeys).toArray(),
    db.outbox
      .where('endKey')
      .anyOf(endKeys)
      .filter((r) => r.userId === userId && r.status !== 'applied')
      .toArray(),
    db.rulings.where('endKey').anyOf(endKeys).toArray(),
    db.endSignatures.where('endKey').anyOf(endKeys).toArray(),
  ]);
  const recordsByEnd = groupBy(records, (r) => r.endKey);
  const settlementByEnd = new Map(settlements.map((s) => [s.endKey, s]));
  const rulingsByEnd = groupBy(rulings, (r) => r.endKey);
  const signaturesByEnd = groupBy(signatures, (r) => r.endKey);
  const waitingByEnd = groupBy(
    mine.filter((m) => m.status === 'pending'),
    (m) => m.endKey,
  );
  const ends = new Map<string, LocalEnd>();
  for (const key of endKeys) {
    ends.set(
      key,
      localEnd(recordsByEnd.get(key) ?? [], settlementByEnd.get(key), waitingByEnd.get(key) ?? [], {
        rulings: rulingsByEnd.get(key) ?? [],
        signatures: signaturesByEnd.get(key) ?? [],
      }),
    );
  }
  return { ends, rejected: mine.filter((m) => m.status === 'rejected') };
}
