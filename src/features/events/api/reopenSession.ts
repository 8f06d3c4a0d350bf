import type { EventSession } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const reopenSession = (eventId: number, sessionId: number) =>
  send<EventSession>(eventPath(eventId, `/sessions/${sessionId}/reopen`), jsonBody('POST'));

export const useReopenSession = (eventId: number) =>
  useEventMutation(eventId, (sessionId: number) => reopenSession(eventId, sessionId));
