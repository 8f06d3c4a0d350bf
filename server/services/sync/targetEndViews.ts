import { endView, endsOfRound } from '../../../src/core';
import type { TargetEndsView } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { loadEndRecords } from '../judging/endRecords';
import { incidentsOf } from '../judging/endWords';
import { targetArchers } from './targetArchers';

/**
 * The server's own cross-check of a target: for each archer and each end of their round, the
 * state derived from the writers' records (with their incident marks), the caller's settlement,
 * the judge's latest ruling and the current signature by core `endView`, the same function the
 * phones run, so server and phones always tell the same story.
 */
export async function targetEndViews(
  db: Db,
  sessionId: number,
  targetNumber: number,
): Promise<TargetEndsView> {
  const archers = await targetArchers(db, sessionId, targetNumber);
  const stored = await loadEndRecords(
    db,
    sessionId,
    archers.map((a) => a.entryId),
  );
  return {
    sessionId,
    targetNumber,
    archers: archers.map((a) => ({
      entryId: a.entryId,
      position: a.position,
      name: a.name,
      ends: endsOfRound(a.round).map((end) => {
        const facts = stored.facts(a.entryId, end.index);
        const { ruling, signature } = stored.end(a.entryId, end.index);
        return {
          endIndex: end.index,
          view: endView(facts),
          incidents: incidentsOf(facts),
          ruling: ruling ?? null,
          signature: signature ?? null,
        };
      }),
    })),
  };
}
