import { arrowPoints, isHit, isTen, isX } from '../arrowValue';
import type { ArrowValue } from '../arrowValue';

/** A practice session's counts, over every arrow shot so far. */
export interface PracticeTally {
  arrows: number;
  total: number;
  /** Points per arrow; 0 before the first arrow. */
  averagePerArrow: number;
  /** 10s include Xs, as on a card (WA Book 3). */
  tens: number;
  xs: number;
  hits: number;
  /** Shares of all arrows, 0 to 1; 0 before the first arrow. */
  tenRate: number;
  xRate: number;
}

export function practiceTally(values: readonly ArrowValue[]): PracticeTally {
  let total = 0;
  let tens = 0;
  let xs = 0;
  let hits = 0;
  for (const value of values) {
    total += arrowPoints(value);
    if (isTen(value)) tens += 1;
    if (isX(value)) xs += 1;
    if (isHit(value)) hits += 1;
  }
  const arrows = values.length;
  const share = (n: number) => (arrows === 0 ? 0 : n / arrows);
  return {
    arrows,
    total,
    averagePerArrow: share(total),
    tens,
    xs,
    hits,
    tenRate: share(tens),
    xRate: share(xs),
  };
}
