import type { EventSession, SessionInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const createSession = (eventId: number, input: SessionInput) =>
  send<EventSession>(eventPath(eventId, '/sessions'), jsonBody('POST', input));

export const useCreateSession = (eventId: number) =>
  useEventMutation(eventId, (input: SessionInput) => createSession(eventId, input));
