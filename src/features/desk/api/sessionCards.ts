import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { SessionCards } from '../../../contract/judging';

export const sessionCardsQuery = (eventId: number, sessionId: number) =>
  queryOptions({
    queryKey: ['session-cards', eventId, sessionId],
    queryFn: () => apiRequest<SessionCards>(`/api/events/${eventId}/sessions/${sessionId}/cards`),
    refetchInterval: 30_000,
  });

export const useSessionCards = (eventId: number, sessionId: number) =>
  useQuery(sessionCardsQuery(eventId, sessionId));
