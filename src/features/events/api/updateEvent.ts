import type { EventDetails, UpdateEventInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const updateEvent = (eventId: number, input: UpdateEventInput) =>
  send<EventDetails>(eventPath(eventId), jsonBody('PATCH', input));

export const useUpdateEvent = (eventId: number) =>
  useEventMutation(eventId, (input: UpdateEventInput) => updateEvent(eventId, input));
