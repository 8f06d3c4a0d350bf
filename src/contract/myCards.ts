/** `GET /api/me/cards`: the signed-in person's own scorecards and the cards they must sign. */
export type MyCard = {
  entryId: number;
  sessionId: number;
  eventName: string;
  sessionName: string;
  division: string;
  targetNumber: number;
  position: 'A' | 'B' | 'C' | 'D';
};

/** A card the person keeps as writer 1 or 2 of its target and no scorer has signed yet. */
export type CardToSign = {
  entryId: number;
  sessionId: number;
  eventName: string;
  sessionName: string;
  archerName: string;
  targetNumber: number;
  position: 'A' | 'B' | 'C' | 'D';
  /** Ends a judge has signed, of the round's ends. */
  signedEnds: number;
  totalEnds: number;
  /** Every end is signed by a judge: the scorer can sign the card now. */
  ready: boolean;
};

export type MyCards = { cards: MyCard[]; toSign: CardToSign[] };
