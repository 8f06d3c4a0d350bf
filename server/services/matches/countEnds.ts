import { sortEnd, type ArrowValue, type EndOnRecord, type MatchEnd } from '../../../src/core';
import { countedEnds } from '../../../src/core/matches';
import type { Db } from '../../db';
import { nowIso } from '../../time';
import type { EndRow, MatchRow } from './matchRows';

type WriteRow = { end_index: number; slot: number; a_json: string; b_json: string };

const parse = (row: Pick<WriteRow, 'a_json' | 'b_json'>): MatchEnd => ({
  a: JSON.parse(row.a_json) as ArrowValue[],
  b: JSON.parse(row.b_json) as ArrowValue[],
});
const sameEnd = (x: MatchEnd, y: MatchEnd) =>
  JSON.stringify([sortEnd(x.a), sortEnd(x.b)]) === JSON.stringify([sortEnd(y.a), sortEnd(y.b)]);

/**
 * Brings the writers' ends in `match_ends` in line with the core's countedEnds after any change to
 * a match's ends: the ends both writers agree on that count are stored (`source` writers), and the
 * writers' ends that no longer count (an earlier end changed by one writer stops the count) are
 * removed until the writers agree again or a judge settles the end that stops them. A judge's end
 * and a signed end are closed: kept as they are.
 */
export async function recountEnds(db: Db, match: MatchRow, userId: number): Promise<void> {
  const [stored, writes] = await Promise.all([
    db('match_ends').where({ match_id: match.id }) as Promise<EndRow[]>,
    db('match_end_writes').where({ match_id: match.id }) as Promise<WriteRow[]>,
  ]);
  const closedRow = (i: number) =>
    stored.find((r) => r.end_index === i && (r.source === 'judge' || r.signed_at !== null));
  const writerEnd = (slot: number, i: number) => {
    const w = writes.find((r) => Number(r.slot) === slot && r.end_index === i);
    return w && parse(w);
  };
  const last = Math.max(-1, ...stored.map((r) => r.end_index), ...writes.map((w) => w.end_index));
  const ends = Array.from({ length: last + 1 }, (_, i): EndOnRecord => {
    const closed = closedRow(i);
    return {
      ...(closed ? { closed: { ...parse(closed), by: closed.source } } : {}),
      writers: [writerEnd(1, i), writerEnd(2, i)],
    };
  });
  const counted = countedEnds(match.format, ends);
  for (const [i, end] of counted.entries()) {
    if (closedRow(i)) continue;
    const had = stored.find((r) => r.end_index === i);
    if (had?.source === 'writers' && sameEnd(parse(had), end)) continue;
    const row = {
      a_json: JSON.stringify(end.a),
      b_json: JSON.stringify(end.b),
      source: 'writers',
      recorded_by: userId,
      recorded_at: nowIso(),
    };
    await db('match_ends')
      .insert({ match_id: match.id, end_index: i, ...row })
      .onConflict(['match_id', 'end_index'])
      .merge(row);
  }
  await db('match_ends')
    .where({ match_id: match.id, source: 'writers' })
    .whereNull('signed_at')
    .where('end_index', '>=', counted.length)
    .delete();
}
