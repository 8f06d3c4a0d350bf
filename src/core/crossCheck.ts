import type { ArrowValue } from './arrowValue';
import { sortEnd } from './ends';

export type CrossCheckStatus = 'waiting' | 'agreed' | 'mismatch';

export interface CrossCheckArrow {
  index: number;
  first?: ArrowValue;
  second?: ArrowValue;
  same: boolean;
}

export interface CrossCheck {
  status: CrossCheckStatus;
  /** Position by position, both ends sorted highest first; empty while waiting. */
  arrows: CrossCheckArrow[];
}

/**
 * Compares the two writers' entries for one end. Both are sorted first, since the same arrows
 * tapped in another order are the same end. A position only one writer filled is a mismatch;
 * nothing is compared until both writers' entries are in.
 */
export function crossCheck(
  first: readonly ArrowValue[] | undefined,
  second: readonly ArrowValue[] | undefined,
): CrossCheck {
  if (first === undefined || second === undefined) return { status: 'waiting', arrows: [] };
  const a = sortEnd(first);
  const b = sortEnd(second);
  const arrows: CrossCheckArrow[] = [];
  for (let index = 0; index < Math.max(a.length, b.length); index += 1) {
    const arrow: CrossCheckArrow = { index, same: a[index] !== undefined && a[index] === b[index] };
    if (a[index] !== undefined) arrow.first = a[index];
    if (b[index] !== undefined) arrow.second = b[index];
    arrows.push(arrow);
  }
  return { status: arrows.every((x) => x.same) ? 'agreed' : 'mismatch', arrows };
}
