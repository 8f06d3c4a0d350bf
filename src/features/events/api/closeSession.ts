import type { EventSession } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const closeSession = (eventId: number, sessionId: number) =>
  send<EventSession>(eventPath(eventId, `/sessions/${sessionId}/close`), jsonBody('POST'));

export const useCloseSession = (eventId: number) =>
  useEventMutation(eventId, (sessionId: number) => closeSession(eventId, sessionId));
