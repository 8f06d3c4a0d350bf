/*
 * Keys of the `meta` rows that belong to one person on a shared phone. They live together so that
 * forgetOthers drops every one of them when the phone changes hands.
 */

const PULL_CURSOR = 'pullCursor:';
const TOURNAMENT_CARDS = 'tournamentCards:';

/** How far this person's pulls have read the server's changes. */
export const pullCursorKey = (userId: number) => `${PULL_CURSOR}${userId}`;
/** The kept copy of the person's tournament cards (features/practice/tournamentCards.ts). */
export const tournamentCardsKey = (userId: number) => `${TOURNAMENT_CARDS}${userId}`;
/** The prefixes of every per-person key above. */
export const PERSON_META_PREFIXES = [PULL_CURSOR, TOURNAMENT_CARDS] as const;
