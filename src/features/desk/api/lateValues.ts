import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import type { LateValueDto } from '../../../contract/lateValues';
import { syncLoop } from '../../../local/syncLoop';

const lateKey = (eventId: number, sessionId: number) =>
  ['events', eventId, 'sessions', sessionId, 'late-values'] as const;

export const fetchLateValues = (eventId: number, sessionId: number) =>
  apiRequest<LateValueDto[]>(`/api/events/${eventId}/sessions/${sessionId}/late-values`);

export const lateValuesQuery = (eventId: number, sessionId: number) =>
  queryOptions({
    queryKey: lateKey(eventId, sessionId),
    queryFn: () => fetchLateValues(eventId, sessionId),
    // Phones bring late values in at any time: look again now and then while the desk is open.
    refetchInterval: 30_000,
  });

export const useLateValues = (eventId: number, sessionId: number) =>
  useQuery(lateValuesQuery(eventId, sessionId));

export type LateDecision = { id: number; accept: true } | { id: number; accept: false; reason: string };

export const decideLateValue = (eventId: number, decision: LateDecision) =>
  apiRequest<void>(
    `/api/events/${eventId}/late-values/${decision.id}/${decision.accept ? 'accept' : 'reject'}`,
    {
      method: 'POST',
      ...(decision.accept ? {} : { body: JSON.stringify({ reason: decision.reason }) }),
    },
  );

/** Accepting or rejecting needs the server; the list and the desk's own copies refresh after. */
export function useDecideLateValue(eventId: number, sessionId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (decision: LateDecision) => decideLateValue(eventId, decision),
    networkMode: 'always',
    onSettled: async () => {
      syncLoop().kick();
      await client.invalidateQueries({ queryKey: lateKey(eventId, sessionId) });
    },
  });
}
