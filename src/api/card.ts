import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { CardView } from '../contract/judging';
import type { MyCards } from '../contract/myCards';

export const cardQuery = (sessionId: number, entryId: number) =>
  queryOptions({
    queryKey: ['card', sessionId, entryId],
    queryFn: () => apiRequest<CardView>(`/api/cards/${sessionId}/${entryId}`),
    // Signatures arrive from the judges' phones: look again now and then while the card is open.
    refetchInterval: 15_000,
  });

export const useCard = (sessionId: number, entryId: number) => useQuery(cardQuery(sessionId, entryId));

export const myCardsQuery = queryOptions({
  queryKey: ['my-cards'],
  queryFn: () => apiRequest<MyCards>('/api/me/cards'),
  // Cards leave "to sign" the moment a signature lands, often seconds after the list was read:
  // look again whenever the list is shown (the last copy stays on screen meanwhile).
  staleTime: 0,
});

export const useMyCards = () => useQuery(myCardsQuery);
