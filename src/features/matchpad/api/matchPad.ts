import { useMutation, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { MatchJoin, MatchPadDto } from '../../../contract/matches';
import { localDb, matchPadKeyOf, type JoinedMatch } from '../../../local/db';
import { syncLoop } from '../../../local/syncLoop';
import { askPersistentStorage } from '../../../local/useSync';

/** How often an open match pad asks for the other writer's ends and the judge's decisions. */
export const MATCH_PAD_POLL_MS = 5_000;

/** Keeps the server's copy of a joined match on the phone, so the pad opens and works offline. */
async function keep(pad: MatchPadDto, userId: number): Promise<JoinedMatch> {
  const row: JoinedMatch = {
    ...pad,
    key: matchPadKeyOf(userId, pad.match.id),
    userId,
    matchId: pad.match.id,
  };
  await localDb().matchPads.put(row);
  return row;
}

/** `POST /api/join/match`: joins a match's target as its writer 1 or 2. */
export async function joinMatch(input: MatchJoin, userId: number): Promise<JoinedMatch> {
  const pad = await apiRequest<MatchPadDto>('/api/join/match', {
    method: 'POST',
    body: JSON.stringify(input),
  });
  const row = await keep(pad, userId);
  await askPersistentStorage();
  syncLoop().kick();
  return row;
}

export const useJoinMatch = () =>
  useMutation({
    mutationFn: ({ input, userId }: { input: MatchJoin; userId: number }) => joinMatch(input, userId),
  });

/** `GET /api/events/:eventId/matches/:matchId/pad`, kept on the phone as it arrives. */
export function useMatchPadRefresh(eventId: number, matchId: number, userId: number) {
  return useQuery({
    queryKey: ['match-pad', eventId, matchId, userId],
    queryFn: async () =>
      keep(await apiRequest<MatchPadDto>(`/api/events/${eventId}/matches/${matchId}/pad`), userId),
    refetchInterval: MATCH_PAD_POLL_MS,
    staleTime: 0,
  });
}
