import type { ArrowValue, FaceId } from '../core';

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

/**
 * `GET /api/me/practice-cards`: the person's own tournament cards for the practice log's history
 * and progress (docs/practice.md): each end a judge signed, at its distance and face. Only cards
 * with at least one signed end; `final` once the archer and the scorer signed the card.
 */
export type TournamentCard = {
  sessionId: number;
  entryId: number;
  eventName: string;
  sessionName: string;
  /** The session's start, ISO 8601 UTC. */
  startedAt: string;
  bowStyle: 'recurve' | 'compound' | 'barebow';
  final: boolean;
  ends: { index: number; distanceM: number; faceId: FaceId; values: ArrowValue[] }[];
};
export type TournamentCards = { cards: TournamentCard[] };
