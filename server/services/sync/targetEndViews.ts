import { endView, endsOfRound, type ArrowValue, type EndFacts } from '../../../src/core';
import type { TargetEndsView } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { targetArchers } from './targetArchers';

type RecordRow = { entry_id: number; end_index: number; slot: number; revision: number; arrows_json: string };
type SettlementRowPart = {
  entry_id: number;
  end_index: number;
  arrows_json: string;
  disputed_json: string;
  basis_json: string;
};

/**
 * The server's own cross-check of a target: for each archer and each end of their round, the
 * state derived from the writers' records and the caller's settlement by core `endView`, the
 * same function the phones run, so server and phones always tell the same story.
 */
export async function targetEndViews(
  db: Db,
  sessionId: number,
  targetNumber: number,
): Promise<TargetEndsView> {
  const archers = await targetArchers(db, sessionId, targetNumber);
  const entryIds = archers.map((a) => a.entryId);
  const records = (await db('end_entries')
    .where({ session_id: sessionId })
    .whereIn('entry_id', entryIds)
    .select('entry_id', 'end_index', 'slot', 'revision', 'arrows_json')) as RecordRow[];
  const settlements = (await db('end_settlements')
    .where({ session_id: sessionId })
    .whereIn('entry_id', entryIds)
    .select('entry_id', 'end_index', 'arrows_json', 'disputed_json', 'basis_json')) as SettlementRowPart[];

  const facts = new Map<string, EndFacts>();
  const factsOf = (entryId: number, endIndex: number): EndFacts => {
    const key = `${entryId}:${endIndex}`;
    if (!facts.has(key)) facts.set(key, {});
    return facts.get(key)!;
  };
  for (const r of records) {
    const writer = { arrows: JSON.parse(r.arrows_json) as ArrowValue[], revision: r.revision };
    if (r.slot === 1) factsOf(r.entry_id, r.end_index).first = writer;
    else factsOf(r.entry_id, r.end_index).second = writer;
  }
  for (const s of settlements) {
    factsOf(s.entry_id, s.end_index).settlement = {
      arrows: JSON.parse(s.arrows_json) as ArrowValue[],
      disputed: JSON.parse(s.disputed_json) as number[],
      basis: JSON.parse(s.basis_json) as { first: number; second: number },
    };
  }

  return {
    sessionId,
    targetNumber,
    archers: archers.map((a) => ({
      entryId: a.entryId,
      position: a.position,
      name: a.name,
      ends: endsOfRound(a.round).map((end) => ({
        endIndex: end.index,
        view: endView(facts.get(`${a.entryId}:${end.index}`) ?? {}),
      })),
    })),
  };
}
