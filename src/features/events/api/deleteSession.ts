import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const deleteSession = (eventId: number, sessionId: number) =>
  send<void>(eventPath(eventId, `/sessions/${sessionId}`), jsonBody('DELETE'));

export const useDeleteSession = (eventId: number) =>
  useEventMutation(eventId, (sessionId: number) => deleteSession(eventId, sessionId));
