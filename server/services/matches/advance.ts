import type { Side } from '../../../src/core';
import { other } from '../../../src/core/matches';
import type { Db } from '../../db';
import type { MatchRow } from './matchRows';

/** Puts a side (its seed and archers) into a match of the bracket on the upper or lower line. */
export async function placeSide(
  db: Db,
  matchId: number,
  side: Side,
  seed: number,
  entryIds: readonly number[],
): Promise<void> {
  const [row] = await db('match_sides').insert({ match_id: matchId, side, seed }).returning('id');
  const sideId = (row as { id: number }).id;
  await db('match_side_archers').insert(entryIds.map((entry_id) => ({ match_side_id: sideId, entry_id })));
}

async function sideOf(
  db: Db,
  matchId: number,
  side: Side,
): Promise<{ seed: number; entryIds: number[] } | undefined> {
  const row = (await db('match_sides').where({ match_id: matchId, side }).first('id', 'seed')) as
    { id: number; seed: number } | undefined;
  if (!row) return undefined;
  const archers = (await db('match_side_archers')
    .where({ match_side_id: row.id })
    .orderBy('id')
    .select('entry_id')) as {
    entry_id: number;
  }[];
  return { seed: row.seed, entryIds: archers.map((a) => a.entry_id) };
}

async function moveTo(
  db: Db,
  bracketId: number,
  round: number,
  slot: number,
  bronze: boolean,
  from: { seed: number; entryIds: number[] } | undefined,
) {
  if (!from) return;
  const target = (await db('matches')
    .where({ bracket_id: bracketId, round, slot: Math.floor(slot / 2), bronze })
    .first('id')) as { id: number };
  // The winner of an upper match takes the upper line of the next one.
  await placeSide(db, target.id, slot % 2 === 0 ? 'a' : 'b', from.seed, from.entryIds);
}

/**
 * Moves the bracket on once a match has a winner: the winner to the next round; from a
 * semi-final, the loser to the bronze match. The final and the bronze match lead nowhere.
 */
export async function advance(
  db: Db,
  match: Pick<MatchRow, 'id' | 'bracket_id' | 'round' | 'slot' | 'bronze' | 'size'>,
  winner: Side,
): Promise<void> {
  const rounds = Math.log2(match.size);
  if (match.bronze || match.round === rounds - 1) return;
  await moveTo(db, match.bracket_id, match.round + 1, match.slot, false, await sideOf(db, match.id, winner));
  if (match.round === rounds - 2) {
    await moveTo(
      db,
      match.bracket_id,
      rounds - 1,
      match.slot,
      true,
      await sideOf(db, match.id, other(winner)),
    );
  }
}
