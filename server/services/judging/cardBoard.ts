import type { CardBoard, CardBoardTarget } from '../../../src/contract/cardBoard';
import type { Db } from '../../db';
import type { SessionRow } from '../organizer/sessions';
import { sessionCards } from './cardViews';

/** The session's cards with, per target, how far its slowest card has come and how far behind it is. */
export async function cardBoard(db: Db, session: SessionRow): Promise<CardBoard> {
  const { cards } = await sessionCards(db, session);
  const byTarget = new Map<number, typeof cards>();
  for (const card of cards)
    byTarget.set(card.targetNumber, [...(byTarget.get(card.targetNumber) ?? []), card]);
  const counted = [...byTarget].map(([targetNumber, own]) => ({
    targetNumber,
    endsIn: Math.min(...own.map((c) => c.endsWithValues)),
    signedEnds: Math.min(...own.map((c) => c.signedEnds)),
    cardsNotFinal: own.filter((c) => !c.final).length,
  }));
  const leadingEnds = Math.max(0, ...counted.map((t) => t.endsIn));
  const targets: CardBoardTarget[] = counted.map((t) => ({ ...t, behindBy: leadingEnds - t.endsIn }));
  return { sessionId: session.id, sessionName: session.name, leadingEnds, targets, cards };
}
