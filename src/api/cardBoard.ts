import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { CardBoard } from '../contract/cardBoard';
import type { CardSendResult } from '../contract/judging';

const boardKey = (eventId: number, sessionId: number) => ['card-board', eventId, sessionId] as const;

export const cardBoardQuery = (eventId: number, sessionId: number) =>
  queryOptions({
    queryKey: boardKey(eventId, sessionId),
    queryFn: () => apiRequest<CardBoard>(`/api/events/${eventId}/sessions/${sessionId}/card-board`),
    // Ends and signatures arrive all day: look again now and then while the board is open.
    refetchInterval: 20_000,
  });

export const useCardBoard = (eventId: number, sessionId: number) =>
  useQuery(cardBoardQuery(eventId, sessionId));

/** Mails a final card again; the board is read again so "mailed" shows the new time. */
export function useSendCardAgain(eventId: number, sessionId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (entryId: number) =>
      apiRequest<CardSendResult>(`/api/cards/${sessionId}/${entryId}/send`, { method: 'POST' }),
    networkMode: 'always',
    onSuccess: () => client.invalidateQueries({ queryKey: boardKey(eventId, sessionId) }),
  });
}
