import type { SessionCardItem } from './judging';

/** One target of the session on the organizer's card board: how far its cards have come. */
export type CardBoardTarget = {
  targetNumber: number;
  /** Ends every card of the target has values for (the slowest card counts). */
  endsIn: number;
  /** Ends every card of the target has signed by a judge. */
  signedEnds: number;
  /** Ends behind the furthest target of the session; 0 when level with it. */
  behindBy: number;
  /** Cards of the target not final yet. */
  cardsNotFinal: number;
};

/** `GET /api/events/:eventId/sessions/:sessionId/card-board` (organizers): every card and target of a session. */
export type CardBoard = {
  sessionId: number;
  sessionName: string;
  /** Ends the furthest target has in. */
  leadingEnds: number;
  targets: CardBoardTarget[];
  cards: SessionCardItem[];
};
