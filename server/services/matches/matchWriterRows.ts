import type { ArrowValue } from '../../../src/core';
import type { MatchWriteDto } from '../../../src/contract/matches';
import type { Db } from '../../db';

/** What the two writers of a match and its archers added to its card. */
export type WriterRecords = { writes: MatchWriteDto[]; countersignedBy: number[] };

type WriteRow = { match_id: number; end_index: number; slot: 1 | 2; a_json: string; b_json: string };

/** Each writer's own end records and the archers' countersignatures of the given matches, by match id. */
export async function loadWriterRecords(db: Db, matchIds: number[]): Promise<Map<number, WriterRecords>> {
  const [writes, signs] = await Promise.all([
    db('match_end_writes')
      .whereIn('match_id', matchIds)
      .orderBy(['match_id', 'end_index', 'slot']) as Promise<WriteRow[]>,
    db('match_countersignatures')
      .whereIn('match_id', matchIds)
      .orderBy('id')
      .select('match_id', 'entry_id') as Promise<{ match_id: number; entry_id: number }[]>,
  ]);
  const out = new Map<number, WriterRecords>(matchIds.map((id) => [id, { writes: [], countersignedBy: [] }]));
  for (const w of writes) {
    out.get(w.match_id)!.writes.push({
      slot: w.slot,
      endIndex: w.end_index,
      a: JSON.parse(w.a_json) as ArrowValue[],
      b: JSON.parse(w.b_json) as ArrowValue[],
    });
  }
  for (const s of signs) out.get(s.match_id)!.countersignedBy.push(s.entry_id);
  return out;
}
