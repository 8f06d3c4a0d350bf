import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateEventInput, EventDetails } from '../../../contract/events';
import { checkMe } from '../../../local/me';
import { eventKeys, jsonBody, send } from '../../../api/eventKeys';

export const createEvent = (input: CreateEventInput) =>
  send<EventDetails>('/api/events', jsonBody('POST', input));

export function useCreateEvent() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createEvent,
    networkMode: 'always',
    onSuccess: async () => {
      // The creator is now an organizer: both the event list and their roles change.
      await Promise.all([client.invalidateQueries({ queryKey: eventKeys.list }), checkMe()]);
    },
  });
}
