import type { TournamentCard } from '../../contract/myCards';
import { ownSessionParts } from './practiceStore';
import { storedTournamentCards } from './tournamentCards';
import { useStored } from './useStored';

// The keys the practice log and progress share (useStored): each read once for both screens.

/** The sessions of whoever uses the phone now, with their progress parts. */
export const useOwnSessionParts = (owner: number | undefined) =>
  useStored(() => ownSessionParts(owner), `practice-parts:${owner ?? 'none'}`);

/** Their tournament cards kept on the phone. */
export const useStoredTournamentCards = (owner: number | undefined): TournamentCard[] | undefined =>
  useStored(() => storedTournamentCards(owner), `tournament-cards:${owner ?? 'none'}`);
