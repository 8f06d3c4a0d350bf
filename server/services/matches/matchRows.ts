import {
  ScoringError,
  type ArrowValue,
  type MatchFormat,
  type MatchRecord,
  type Side,
} from '../../../src/core';
import { countedEnds, matchState } from '../../../src/core/matches';
import type { MatchDto, MatchEndDto } from '../../../src/contract/matches';
import type { Db } from '../../db';
import { conflict, notFound } from '../../http/httpError';

/** One stored match with what the rules need: its bracket's format and size. */
export type MatchRow = {
  id: number;
  bracket_id: number;
  round: number;
  slot: number;
  bronze: number | boolean;
  target_number: number | null;
  winner_side: Side | null;
  decided_by: MatchDto['decidedBy'];
  signed_at: string | null;
  format: MatchFormat;
  size: number;
};

export async function findMatch(db: Db, eventId: number, matchId: number): Promise<MatchRow> {
  const row = (await db('matches as m')
    .join('brackets as b', 'b.id', 'm.bracket_id')
    .where({ 'm.id': matchId, 'b.event_id': eventId })
    .first(
      'm.id',
      'm.bracket_id',
      'm.round',
      'm.slot',
      'm.bronze',
      'm.target_number',
      'm.winner_side',
      'm.decided_by',
      'm.signed_at',
      'b.format',
      'b.size',
    )) as MatchRow | undefined;
  if (!row) throw notFound('That match does not exist in this event.');
  return row;
}

export function requireOpen(match: MatchRow): void {
  if (match.winner_side) {
    const how = match.decided_by === 'score' || match.decided_by === 'shoot-off' ? 'signed' : 'decided';
    throw conflict(`This match is already ${how}; it cannot change any more.`);
  }
}

export async function requireBothSides(db: Db, matchId: number): Promise<void> {
  const sides = await db('match_sides').where({ match_id: matchId }).count({ n: '*' }).first();
  if (Number(sides?.n) < 2)
    throw conflict('Both archers of this match are not known yet: earlier matches are still open.');
}

export type EndRow = {
  match_id: number;
  end_index: number;
  a_json: string;
  b_json: string;
  source: 'writers' | 'judge';
  signed_at: string | null;
};

type StoredEnd = MatchEndDto & { by: EndRow['source'] };

/** A stored end as the card shows it: its values, who made it count, and the judge's signature. */
export const endOfRow = (e: EndRow): StoredEnd => ({
  a: JSON.parse(e.a_json) as ArrowValue[],
  b: JSON.parse(e.b_json) as ArrowValue[],
  by: e.source,
  ...(e.signed_at ? { signed: true as const } : {}),
});
type ShootRow = {
  match_id: number;
  side: Side;
  value: ArrowValue;
  distance_mm: number | null;
  closer: number | boolean;
};

/**
 * The match cards of the given matches as the core reads them, by match id: the stored ends that
 * count (the core's countedEnds, so a judge's end kept after an end that left the count waits
 * for it) and the shoot-off arrows.
 */
export async function loadRecords(
  db: Db,
  matchIds: number[],
): Promise<Map<number, Pick<MatchDto, 'ends' | 'shootOff'>>> {
  const ends = (await db('match_ends as e')
    .join('matches as m', 'm.id', 'e.match_id')
    .join('brackets as b', 'b.id', 'm.bracket_id')
    .whereIn('e.match_id', matchIds)
    .orderBy(['e.match_id', 'e.end_index'])
    .select(
      'e.match_id',
      'e.end_index',
      'e.a_json',
      'e.b_json',
      'e.source',
      'e.signed_at',
      'b.format',
    )) as (EndRow & {
    format: MatchFormat;
  })[];
  const shots = (await db('match_shootoff_arrows').whereIn('match_id', matchIds)) as ShootRow[];
  const stored = new Map<number, { format: MatchFormat; ends: StoredEnd[] }>();
  for (const e of ends) {
    const match = stored.get(e.match_id) ?? { format: e.format, ends: [] };
    match.ends[e.end_index] = endOfRow(e);
    stored.set(e.match_id, match);
  }
  const records = new Map(
    matchIds.map((id) => {
      const match = stored.get(id);
      const counted = match
        ? countedEnds(
            match.format,
            Array.from(match.ends, (closed) => closed && { closed }),
          )
        : [];
      return [id, { ends: counted as StoredEnd[], shootOff: {} as MatchDto['shootOff'] }];
    }),
  );
  for (const s of shots) {
    records.get(s.match_id)!.shootOff[s.side] = {
      value: s.value,
      ...(s.distance_mm !== null ? { distanceMm: s.distance_mm } : {}),
      ...(s.closer ? { closer: true } : {}),
    };
  }
  return records;
}

/** The core's reading of a card; a card the rules cannot produce is refused in the core's words. */
export function readMatch(format: MatchFormat, record: MatchRecord) {
  try {
    return matchState(format, record);
  } catch (error) {
    if (error instanceof ScoringError) throw conflict(error.message);
    throw error;
  }
}
