import { arrowPoints } from '../arrowValue';
import type { ShootOffArrow } from '../ranking';

/** The two sides of a match: `a` is the better seed (the upper line of the bracket). */
export type Side = 'a' | 'b';

export const other = (side: Side): Side => (side === 'a' ? 'b' : 'a');

/** What the one-arrow shoot-off of a match says so far. */
export type ShootOffOutcome =
  | { winner: Side }
  /** `arrows`: someone has not shot yet; `judge`: equal values, nobody measured or marked closer. */
  | { winner: null; waitingFor: 'arrows' | 'judge' };

/**
 * A match's one-arrow shoot-off (WA Book 3, match-play shoot-off, art. 14.3 in the editions in
 * force since 2018, from memory): the higher value wins; equal values, the arrow closest to the
 * centre wins, by the judge's measured distance or, unmeasured, the arrow the judge marked closer.
 * Until the judge says which is closer, the match waits for the judge: it never asks for a second
 * shoot-off arrow.
 */
export function shootOffWinner(a: ShootOffArrow | undefined, b: ShootOffArrow | undefined): ShootOffOutcome {
  if (!a || !b) return { winner: null, waitingFor: 'arrows' };
  const points = arrowPoints(a.value) - arrowPoints(b.value);
  if (points !== 0) return { winner: points > 0 ? 'a' : 'b' };
  if (a.distanceMm !== undefined && b.distanceMm !== undefined && a.distanceMm !== b.distanceMm) {
    return { winner: a.distanceMm < b.distanceMm ? 'a' : 'b' };
  }
  if (Boolean(a.closer) !== Boolean(b.closer)) return { winner: a.closer ? 'a' : 'b' };
  return { winner: null, waitingFor: 'judge' };
}
