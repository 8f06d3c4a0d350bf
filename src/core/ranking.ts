import { ScoringError } from './errors';

export interface RankInput {
  id: string;
  total: number;
  /** 10s including Xs. */
  tens: number;
  xs: number;
}

export interface Placing {
  /** Standard competition ranking: equal archers share a place and the next place is skipped. */
  place: number;
  /** Another archer has the same total, 10s and Xs. */
  tied: boolean;
  /** The tie straddles the cut, so a shoot-off decides who goes through. */
  shootOff: boolean;
}

function compareRows(a: RankInput, b: RankInput): number {
  return b.total - a.total || b.tens - a.tens || b.xs - a.xs;
}

/**
 * Orders archers by total, then 10s (X included), then Xs (WA Book 3 tie-break); archers still
 * equal stay tied and keep their input order. `cut` is how many archers go through to the next
 * stage; a tie that crosses it is flagged for a shoot-off.
 */
export function rankArchers<T extends RankInput>(
  rows: readonly T[],
  opts: { cut?: number } = {},
): (T & Placing)[] {
  const { cut } = opts;
  if (cut !== undefined && !(Number.isInteger(cut) && cut >= 0)) {
    throw new ScoringError('invalid-ranking', `A cut of ${cut} is not a whole number of archers.`);
  }
  for (const row of rows) {
    // A NaN would make the sort order arbitrary rather than fail, so refuse it here.
    if (![row.total, row.tens, row.xs].every(Number.isFinite)) {
      throw new ScoringError(
        'invalid-ranking',
        `Archer ${row.id} has a total, 10s or Xs count that is not a number.`,
      );
    }
  }
  const sorted = [...rows].sort(compareRows);
  const ranked: (T & Placing)[] = [];
  let start = 0;
  while (start < sorted.length) {
    let end = start + 1;
    while (end < sorted.length && compareRows(sorted[start] as T, sorted[end] as T) === 0) end += 1;
    // Positions start+1 … end share place start+1; a cut between them leaves the tie undecided.
    const tied = end - start > 1;
    const shootOff = tied && cut !== undefined && start < cut && cut < end;
    for (let i = start; i < end; i += 1) {
      ranked.push({ ...(sorted[i] as T), place: start + 1, tied, shootOff });
    }
    start = end;
  }
  return ranked;
}
