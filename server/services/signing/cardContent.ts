import { cardTotals, sortEnd, type ArrowValue, type RoundDefinition } from '../../../src/core';
import type { Position } from '../../../src/contract/events';

/** Where a card lives: what a card signature's `ref` names. */
export type SignedCardRef = { eventId: number; sessionId: number; entryId: number };

export type CardTotalsSigned = { total: number; tens: number; xs: number; hits: number };

/** Everything a card signature covers, as read from the entry list, the session and the signed ends. */
export type CardFacts = SignedCardRef & {
  event: { name: string; startsOn: string; endsOn: string };
  session: { name: string; startsAt: string };
  archer: { name: string; club: string; division: string };
  /** The archer's place on the field; null once the archer has no target in the session. */
  place: { targetNumber: number; position: Position } | null;
  round: RoundDefinition;
  /** Per end of the round in shooting order: the signed values and that signature's content hash. */
  ends: ({ arrows: readonly ArrowValue[]; hash: string } | undefined)[];
};

/** How a countersignature made on paper is labelled; `judge` is who recorded it. */
export const paperWords = (judge: string) => `countersigned on paper, recorded by judge ${judge}`;

/** A countersignature made on paper and recorded by a judge, as its signature states it. */
export type PaperCountersign = { recordedBy: string; photoSha256: string };

export const cardTotalsOf = (round: RoundDefinition, ends: CardFacts['ends']): CardTotalsSigned => {
  const t = cardTotals(
    round,
    ends.map((e) => e?.arrows),
  );
  return { total: t.total, tens: t.tens, xs: t.xs, hits: t.hits };
};

/**
 * What the archer's and the scorer's signatures on a card cover: everything printed on the card
 * that identifies it (event name and dates, session name and start, archer, club, division,
 * target and position, round), every end's values, the totals, and the hash of each end's judge
 * signature; for a countersignature made on paper, that it was, who recorded it and the photo
 * of the paper card. Renaming any of these after signing shows in verification. Signing and
 * verifying both build it here; the content as signed is stored with the signature.
 */
export function cardContent(card: CardFacts, paper?: PaperCountersign) {
  return {
    typ: 'ringcall-card',
    event: { id: card.eventId, ...card.event },
    session: { id: card.sessionId, ...card.session },
    entry: card.entryId,
    archer: card.archer,
    place: card.place,
    round: { id: card.round.id, name: card.round.name },
    ends: card.ends.map((e) => (e ? sortEnd(e.arrows) : null)),
    totals: cardTotalsOf(card.round, card.ends),
    endSignatures: card.ends.map((e) => e?.hash ?? null),
    ...(paper
      ? {
          countersigned: paperWords(paper.recordedBy),
          paperPhotoSha256: paper.photoSha256,
        }
      : {}),
  };
}
export type CardContent = ReturnType<typeof cardContent>;
