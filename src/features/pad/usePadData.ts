import { useLiveQuery } from 'dexie-react-hooks';
import {
  endKeyOf,
  localDb,
  type EndRecordRow,
  type JoinedTarget,
  type OutboxRow,
  type SettlementRow,
} from '../../local/db';
import { localEnd, type LocalEnd } from '../../local/endFacts';

export type PadData = {
  target: JoinedTarget;
  /** By session:entry:end. */
  ends: Map<string, LocalEnd>;
  rejected: OutboxRow[];
};

/** Everything the pad shows for one joined target, live from IndexedDB (works offline). */
export function usePadData(
  sessionId: number,
  targetNumber: number,
  userId: number | undefined,
): PadData | null | undefined {
  return useLiveQuery(async () => {
    const db = localDb();
    const candidates = await db.targets
      .filter((t) => t.session.id === sessionId && t.targetNumber === targetNumber)
      .toArray();
    // The person signed in now, or (offline, sign-in unknown) whoever joined last on this phone.
    const target =
      candidates.find((t) => t.userId === userId) ??
      candidates.sort((a, b) => b.joinedAt.localeCompare(a.joinedAt))[0];
    if (!target) return null;
    const [records, settlements, mine] = await Promise.all([
      db.endRecords.where('sessionId').equals(sessionId).toArray(),
      db.settlements.where('sessionId').equals(sessionId).toArray(),
      db.outbox.where('userId').equals(target.userId).toArray(),
    ]);
    const entryIds = new Set(target.archers.map((a) => a.entryId));
    const recordsByEnd = groupBy(
      records.filter((r) => entryIds.has(r.entryId)),
      (r) => r.endKey,
    );
    const settlementByEnd = new Map<string, SettlementRow>(settlements.map((s) => [s.endKey, s]));
    const waitingByEnd = groupBy(
      mine.filter((m) => m.status === 'pending' && m.args.sessionId === sessionId),
      (m) => m.endKey,
    );
    const ends = new Map<string, LocalEnd>();
    for (const archer of target.archers) {
      const endCount = archer.round.distances.reduce((n, d) => n + d.arrows / d.arrowsPerEnd, 0);
      for (let endIndex = 0; endIndex < endCount; endIndex += 1) {
        const key = endKeyOf(sessionId, archer.entryId, endIndex);
        ends.set(
          key,
          localEnd(recordsByEnd.get(key) ?? [], settlementByEnd.get(key), waitingByEnd.get(key) ?? []),
        );
      }
    }
    const rejected = mine.filter((m) => m.status === 'rejected' && m.args.sessionId === sessionId);
    return { target, ends, rejected };
  }, [sessionId, targetNumber, userId]);
}

function groupBy<T>(rows: T[], key: (row: T) => string): Map<string, T[]> {
  const map = new Map<string, T[]>();
  for (const row of rows) map.set(key(row), [...(map.get(key(row)) ?? []), row]);
  return map;
}

export type { EndRecordRow };
