/**
 * Which matches of a bracket are shot alternately, as the organizer sets it for the bracket:
 * never, the medal matches only (bronze and gold), or from the semi-finals on (the semi-finals
 * and both medal matches). Whose arrow is next in such a match: `nextArrow` (shootingOrder.ts).
 */
export const ALTERNATE_FROM = ['never', 'medal-matches', 'semi-finals'] as const;
export type AlternateFrom = (typeof ALTERNATE_FROM)[number];

/** Whether a match (round from 0; the bronze match is in the last round) of a bracket of `rounds` rounds alternates. */
export function alternates(from: AlternateFrom, match: { round: number }, rounds: number): boolean {
  if (from === 'never') return false;
  return match.round >= rounds - (from === 'medal-matches' ? 1 : 2);
}
