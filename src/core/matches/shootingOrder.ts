import { ScoringError } from '../errors';
import type { ArrowValue } from '../arrowValue';
import {
  MATCH_ARROWS_PER_END,
  matchState,
  type MatchFormat,
  type MatchRecord,
  type Pair,
} from './matchState';
import { other, type Side } from './shootOff';

/*
 * Alternate shooting in the finals (WA Book 3, match play, the article on alternate shooting beside
 * the time limits, art. 14.4 in the editions in force since 2018: number and wording FROM MEMORY,
 * check them against the edition in force):
 * - the higher-ranked archer (the better seed) decides who shoots first in the first end;
 * - in each following end the archer with the lower score shoots first: the lower set points in
 *   the set system (the score on the card; its arrow totals only decide sets), the lower running
 *   total in the cumulative system;
 * - level, the archer who shot first in the first end shoots first;
 * - the shoot-off: the match is level when it comes, so by the same rule the archer who shot
 *   first in the first end shoots first (from memory too);
 * - within an end the two archers shoot one arrow each in turn.
 */

/** Who shoots first in the next end (or the shoot-off) at this score: the side behind, level the first end's. */
export function firstInEnd(score: Pair, chosen: Side): Side {
  if (score.a === score.b) return chosen;
  return score.a < score.b ? 'a' : 'b';
}

/** The order of one end's arrows, one each in turn from `first`: 3 each, or 1 each in the shoot-off. */
export function endOrder(first: Side, arrowsEach: number): Side[] {
  return Array.from({ length: arrowsEach * 2 }, (_, i) => (i % 2 === 0 ? first : other(first)));
}

/** The arrows entered so far in the end being shot (or the shoot-off), each side's in the order shot. */
export type EndSoFar = { a: readonly ArrowValue[]; b: readonly ArrowValue[] };

/**
 * The order of the arrows of the end a match shot alternately asks for next (the shoot-off once it
 * asks for that), from its record (the complete ends so far) and the side chosen to shoot first
 * in the first end; empty when it asks for no more arrows (decided, or waiting for the judge's
 * word). Refuses a card the rules cannot produce.
 */
export function shootingOrder(format: MatchFormat, record: MatchRecord, chosen: Side): Side[] {
  const state = matchState(format, record);
  const each = state.next === 'end' ? MATCH_ARROWS_PER_END : state.next === 'shoot-off' ? 1 : 0;
  return endOrder(firstInEnd(state.score, chosen), each);
}

/** Which places of the order the arrows entered so far fill (an arrow entered out of turn fills its side's next place). */
function filled(order: readonly Side[], current: EndSoFar): boolean[] {
  const seen = { a: 0, b: 0 };
  return order.map((side) => {
    seen[side] += 1;
    return seen[side] <= current[side].length;
  });
}

/** Whose arrow is next in this order: the first place not yet filled; null once every place is. */
export function nextInOrder(order: readonly Side[], current: EndSoFar): Side | null {
  const at = filled(order, current).indexOf(false);
  return at === -1 ? null : order[at]!;
}

/** Whose arrow was entered last in this order (the one an undo takes back); null before the first. */
export function lastInOrder(order: readonly Side[], current: EndSoFar): Side | null {
  const at = filled(order, current).lastIndexOf(true);
  return at === -1 ? null : order[at]!;
}

/**
 * Whose arrow is next in a match shot alternately, from its record (the complete ends before the
 * one being shot), the side chosen to shoot first in the first end, and the arrows entered so far
 * in the end being shot (the shoot-off once the match asks for it). Null when that end is complete
 * or the match asks for no more arrows. Refuses a card the rules cannot produce and more arrows
 * than the end has.
 */
export function nextArrow(
  format: MatchFormat,
  record: MatchRecord,
  chosen: Side,
  current: EndSoFar,
): Side | null {
  const order = shootingOrder(format, record, chosen);
  const each = order.length / 2;
  for (const side of ['a', 'b'] as const) {
    if (each > 0 && current[side].length > each)
      throw new ScoringError(
        'invalid-match',
        `${each === 1 ? 'The shoot-off' : 'An end'} of a match has ${each} ${each === 1 ? 'arrow' : 'arrows'} a side, not ${current[side].length}.`,
      );
  }
  return nextInOrder(order, current);
}
