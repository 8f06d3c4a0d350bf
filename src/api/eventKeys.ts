import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from './request';

/** Query keys of the event setup: everything of one event sits under ['events', id]. */
export const eventKeys = {
  list: ['events'] as const,
  event: (eventId: number) => ['events', eventId] as const,
  summary: (eventId: number) => ['events', eventId, 'summary'] as const,
  entries: (eventId: number) => ['events', eventId, 'entries'] as const,
  staff: (eventId: number) => ['events', eventId, 'staff'] as const,
  targets: (eventId: number, sessionId: number) =>
    ['events', eventId, 'sessions', sessionId, 'targets'] as const,
};

/** JSON body for apiRequest. */
export const jsonBody = (method: 'POST' | 'PUT' | 'PATCH' | 'DELETE', body?: unknown): RequestInit => ({
  method,
  ...(body === undefined ? {} : { body: JSON.stringify(body) }),
});

export const eventPath = (eventId: number, rest = '') => `/api/events/${eventId}${rest}`;

/**
 * A setup change: calls the API, then refreshes everything cached for the event (summary,
 * entries, staff, targets) and the event list, since counts and names show in several places.
 */
export function useEventMutation<Input, Output>(
  eventId: number,
  call: (input: Input) => Promise<Output>,
  onDone?: (output: Output) => void,
) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: call,
    // Setup changes need the server; do not queue them for later like field data.
    networkMode: 'always',
    onSuccess: async (output) => {
      onDone?.(output);
      await Promise.all([
        client.invalidateQueries({ queryKey: eventKeys.event(eventId) }),
        client.invalidateQueries({ queryKey: eventKeys.list, exact: true }),
      ]);
    },
  });
}

export const send = <T>(path: string, init: RequestInit) => apiRequest<T>(path, init);
