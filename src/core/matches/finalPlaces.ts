import { ScoringError } from '../errors';

export interface BracketArcher {
  id: string;
  /** Qualification rank, which is also the seed. */
  seed: number;
  /** 1–4 from the final and the bronze match, once shot. */
  medal?: 1 | 2 | 3 | 4 | undefined;
  /** The round (0 = first) the archer lost in, withdrawals and no-shows included. */
  lostInRound?: number | undefined;
}

export interface FinalPlace {
  id: string;
  /** Null while the archer is still in the bracket or waits for a medal match. */
  place: number | null;
}

/**
 * Final places of an elimination bracket with `rounds` rounds: 1–4 from the final and the bronze
 * match; after them, archers by the round they lost in (later first), those of the same round in
 * qualification order (as the organizer's brief asks; the rule book lets them share a place, from
 * memory). Semi-final losers and finalists get their place only from their medal match.
 */
export function finalPlaces(archers: readonly BracketArcher[], rounds: number): FinalPlace[] {
  for (const a of archers) {
    if (a.lostInRound !== undefined && (a.lostInRound < 0 || a.lostInRound >= rounds)) {
      throw new ScoringError(
        'invalid-bracket',
        `Archer ${a.id} cannot lose in round ${a.lostInRound + 1} of ${rounds}.`,
      );
    }
  }
  const semiFinal = rounds - 2;
  const out = archers.filter(
    (a) => a.medal === undefined && a.lostInRound !== undefined && a.lostInRound < semiFinal,
  );
  out.sort((x, y) => y.lostInRound! - x.lostInRound! || x.seed - y.seed);
  const places = new Map(out.map((a, i) => [a.id, 5 + i]));
  return archers.map((a) => ({ id: a.id, place: a.medal ?? places.get(a.id) ?? null }));
}
