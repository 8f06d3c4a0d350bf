import { useEffect } from 'react';
import type { TournamentCard, TournamentCards } from '../../contract/myCards';
import type { ProgressSession } from '../../core/practice/progress';
import { progressParts } from '../../core/practice/progressParts';
import { NO_ACCOUNT, localDb } from '../../local/db';
import { tournamentCardsKey } from '../../local/personMeta';
import { phoneOwner } from '../../local/phoneOwner';

/*
 * The person's own tournament cards in the practice log's history and progress (read-only):
 * asked of the server when the log opens, and kept on the phone for offline (in `meta`, one
 * copy per person; forgetOthers drops it when the phone changes hands).
 */

/** The copy kept for whoever uses the phone now; none with no one signed in. */
export async function storedTournamentCards(
  owner: number | undefined,
  db = localDb(),
): Promise<TournamentCard[]> {
  if (owner === undefined || owner === NO_ACCOUNT) return [];
  return (
    ((await db.meta.get(tournamentCardsKey(owner)))?.value as TournamentCard[] | undefined) ?? []
  );
}

/** Asks for the person's cards and keeps them; offline or signed out, the copy kept before stays. */
export async function refreshTournamentCards(owner: number | undefined, db = localDb()): Promise<void> {
  // No one signed in: there is no account to ask (and storedTournamentCards shows none).
  if (owner === undefined || owner === NO_ACCOUNT) return;
  // The fetch wrapper loads with this call: the log's first load stays IndexedDB alone.
  const { apiRequest } = await import('../../api/request');
  const { cards } = await apiRequest<TournamentCards>('/api/me/practice-cards').catch(() => ({
    cards: undefined,
  }));
  // The phone may have changed hands while the answer travelled. An unchanged answer is not
  // written: the write would make the log and progress read and draw everything again.
  if (!cards || phoneOwner() !== owner) return;
  const key = tournamentCardsKey(owner);
  if (JSON.stringify((await db.meta.get(key))?.value) !== JSON.stringify(cards))
    await db.meta.put({ key, value: cards });
}

export const tournamentTitle = (card: TournamentCard) => `${card.eventName}, ${card.sessionName}`;

/** A card as progress reads a session: its signed ends at their distances and faces, marked as a tournament. */
export const tournamentProgress = (cards: readonly TournamentCard[]): ProgressSession[] =>
  cards.map((card) => ({
    id: `tournament:${card.sessionId}:${card.entryId}`,
    startedAt: card.startedAt,
    bowStyle: card.bowStyle,
    parts: progressParts(
      card.ends.map((e) => ({
        distanceM: e.distanceM,
        faceId: e.faceId,
        arrows: e.values.map((value) => ({ value })),
      })),
    ),
    tournament: tournamentTitle(card),
  }));

/** The useEffect of a screen showing the cards: ask for them again when it opens. */
export function useFreshTournamentCards(owner: number | undefined): void {
  useEffect(() => void refreshTournamentCards(owner), [owner]);
}
