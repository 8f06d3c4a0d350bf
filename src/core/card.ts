import { arrowPoints, isHit, isNine, isTen, isX } from './arrowValue';
import type { ArrowValue } from './arrowValue';
import { countingArrows } from './ends';
import { ScoringError } from './errors';
import { MAX_ARROW_POINTS, endsOfRound, roundMaxScore } from './rounds';
import type { RoundDefinition } from './rounds';

export interface Tally {
  total: number;
  hits: number;
  /** 10s including Xs, as counted for ties (WA Book 3). */
  tens: number;
  xs: number;
  /** 9s, the second tie count indoors (see ranking.ts). */
  nines: number;
  /** Arrows on the card that count (an end with too many keeps only its lowest). */
  arrowsShot: number;
  /** Best total the entered ends could have given. */
  maxSoFar: number;
}

export interface CardEnd {
  index: number;
  distanceIndex: number;
  /** Counting arrows, highest first; undefined while the end is not entered. */
  values: ArrowValue[] | undefined;
  total: number | undefined;
  /** Sum of entered ends up to and including this one; undefined while this end is not entered. */
  runningTotal: number | undefined;
}

export interface DistanceTally extends Tally {
  distanceIndex: number;
  label: string;
  max: number;
}

export interface CardTotals extends Tally {
  ends: CardEnd[];
  distances: DistanceTally[];
  roundMax: number;
}

function emptyTally(): Tally {
  return { total: 0, hits: 0, tens: 0, xs: 0, nines: 0, arrowsShot: 0, maxSoFar: 0 };
}

function tallyEnd(values: readonly ArrowValue[], arrowsInEnd: number): Tally {
  const tally = emptyTally();
  tally.arrowsShot = values.length;
  tally.maxSoFar = arrowsInEnd * MAX_ARROW_POINTS;
  for (const v of values) {
    tally.total += arrowPoints(v);
    if (isHit(v)) tally.hits += 1;
    if (isTen(v)) tally.tens += 1;
    if (isX(v)) tally.xs += 1;
    if (isNine(v)) tally.nines += 1;
  }
  return tally;
}

function addTally(into: Tally, add: Tally): void {
  into.total += add.total;
  into.hits += add.hits;
  into.tens += add.tens;
  into.xs += add.xs;
  into.nines += add.nines;
  into.arrowsShot += add.arrowsShot;
  into.maxSoFar += add.maxSoFar;
}

/**
 * Totals for one archer's card. `ends[i]` is the i-th end of the round in shooting order
 * (see `endsOfRound`); a missing entry is an end not entered yet.
 */
export function cardTotals(
  round: RoundDefinition,
  ends: readonly (readonly ArrowValue[] | undefined)[],
): CardTotals {
  const layout = endsOfRound(round);
  if (ends.length > layout.length) {
    throw new ScoringError(
      'invalid-card',
      `The card has ${ends.length} ends; the ${round.name} has ${layout.length}.`,
    );
  }
  const overall = emptyTally();
  const distances: DistanceTally[] = round.distances.map((d, distanceIndex) => ({
    ...emptyTally(),
    distanceIndex,
    label: d.label,
    max: d.arrows * MAX_ARROW_POINTS,
  }));
  const cardEnds: CardEnd[] = [];

  for (const end of layout) {
    const entered = ends[end.index];
    const distance = distances[end.distanceIndex];
    if (!entered || !distance) {
      cardEnds.push({
        index: end.index,
        distanceIndex: end.distanceIndex,
        values: undefined,
        total: undefined,
        runningTotal: undefined,
      });
      continue;
    }
    const values = countingArrows(entered, end.arrows);
    const endTally = tallyEnd(values, end.arrows);
    addTally(overall, endTally);
    addTally(distance, endTally);
    cardEnds.push({
      index: end.index,
      distanceIndex: end.distanceIndex,
      values,
      total: endTally.total,
      runningTotal: overall.total,
    });
  }

  return { ...overall, ends: cardEnds, distances, roundMax: roundMaxScore(round) };
}
