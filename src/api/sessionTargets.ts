import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './request';
import type { TargetList } from '../contract/events';
import { eventKeys, eventPath } from './eventKeys';

export const sessionPath = (eventId: number, sessionId: number, rest = '') =>
  eventPath(eventId, `/sessions/${sessionId}${rest}`);

const fetchSessionTargets = (eventId: number, sessionId: number) =>
  apiRequest<TargetList>(sessionPath(eventId, sessionId, '/targets'));

export const sessionTargetsQuery = (eventId: number, sessionId: number) =>
  queryOptions({
    queryKey: eventKeys.targets(eventId, sessionId),
    queryFn: () => fetchSessionTargets(eventId, sessionId),
  });

export const useSessionTargets = (eventId: number, sessionId: number) =>
  useQuery(sessionTargetsQuery(eventId, sessionId));

/** A layout change answers with the new layout: it replaces the cached one at once; counts elsewhere refresh. */
export function useTargetMutation<Input>(
  eventId: number,
  sessionId: number,
  call: (input: Input) => Promise<TargetList>,
) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: call,
    networkMode: 'always',
    onSuccess: async (list) => {
      client.setQueryData(eventKeys.targets(eventId, sessionId), list);
      await client.invalidateQueries({ queryKey: eventKeys.summary(eventId) });
    },
  });
}
