import { ScoringError, type ArrowValue, type MatchEnd, type MatchFormat, type Side } from '../../core';
import { lastInOrder, nextInOrder, shootingOrder } from '../../core/matches';
import type { MatchDto } from '../../contract/matches';
import { addValues, undoValue, type Draft } from './MatchCardParts';

/*
 * Entering an end of a match shot alternately: each value goes to the archer whose arrow it is,
 * one each in turn from the archer the rules say shoots first (core `shootingOrder`); an undo
 * takes back the last arrow in that order. A match that does not alternate fills the upper
 * line's three, then the lower line's, as before.
 */

/** The order of the arrows of the end after `before`, or null: not alternating, nobody chose who shoots first, nothing to shoot. */
export function alternateOrder(
  match: MatchDto,
  format: MatchFormat,
  before: readonly MatchEnd[],
  first: Side | null,
): Side[] | null {
  if (!match.alternate || !first) return null;
  try {
    const order = shootingOrder(format, { ends: before }, first);
    return order.length > 0 ? order : null;
  } catch (error) {
    // A card the rules refuse shows its problem elsewhere; the entry falls back to line by line.
    if (error instanceof ScoringError) return null;
    throw error;
  }
}

/**
 * Whether to ask who shoots first: an alternating match, nobody chose, end 1 not begun here nor at
 * the server (which refuses the choice once end 1 has an arrow: the entry then goes on line by line).
 */
export const asksWhoShootsFirst = (match: MatchDto, first: Side | null, draft: Draft | null) =>
  match.alternate &&
  !first &&
  !!draft &&
  draft.endIndex === 0 &&
  draft.a.length + draft.b.length === 0 &&
  match.ends.length === 0 &&
  !match.writes.some((w) => w.endIndex === 0 && w.a.length + w.b.length > 0);

export function addInOrder(draft: Draft, values: readonly ArrowValue[], order: Side[] | null): Draft {
  if (!order) return addValues(draft, [...values]);
  let next = draft;
  for (const value of values) {
    const side = nextInOrder(order, next);
    if (!side) break;
    next = { ...next, [side]: [...next[side], value] };
  }
  return next;
}

export function undoInOrder(draft: Draft, order: Side[] | null): Draft {
  const side = order && lastInOrder(order, draft);
  return side ? { ...draft, [side]: draft[side].slice(0, -1) } : undoValue(draft);
}
