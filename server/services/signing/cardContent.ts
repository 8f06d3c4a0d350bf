import { cardTotals, sortEnd, type ArrowValue, type RoundDefinition } from '../../../src/core';
import { contentHash } from '../../signing/contentHash';

/** Where a card lives: what a card signature's `ref` names. */
export type CardRef = { eventId: number; sessionId: number; entryId: number };

export type CardTotalsSigned = { total: number; tens: number; xs: number; hits: number };

/** Everything a card signature covers, as read from the signed ends. */
export type CardFacts = CardRef & {
  archerName: string;
  divisionName: string;
  round: RoundDefinition;
  /** Per end of the round in shooting order: the signed values and that signature's content hash. */
  ends: ({ arrows: readonly ArrowValue[]; hash: string } | undefined)[];
};

export const cardTotalsOf = (round: RoundDefinition, ends: CardFacts['ends']): CardTotalsSigned => {
  const t = cardTotals(
    round,
    ends.map((e) => e?.arrows),
  );
  return { total: t.total, tens: t.tens, xs: t.xs, hits: t.hits };
};

/**
 * What the archer's and the scorer's signatures on a card cover: the card's place, the archer
 * and division as named on the entry list, the round, every end's values, the totals, and the
 * hash of each end's judge signature. Ids rather than the event's name, so renaming the event
 * leaves signed cards valid; the archer's name and division are on the card, so changing them
 * shows. Signing and verifying both build it here.
 */
export function cardContent(card: CardFacts) {
  return {
    typ: 'ringcall-card',
    event: card.eventId,
    session: card.sessionId,
    entry: card.entryId,
    archer: card.archerName,
    division: card.divisionName,
    round: card.round.id,
    ends: card.ends.map((e) => (e ? sortEnd(e.arrows) : null)),
    totals: cardTotalsOf(card.round, card.ends),
    endSignatures: card.ends.map((e) => e?.hash ?? null),
  };
}

export const cardContentHash = (card: CardFacts): string => contentHash(cardContent(card));
