import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const deleteEntry = (eventId: number, entryId: number) =>
  send<void>(eventPath(eventId, `/entries/${entryId}`), jsonBody('DELETE'));

export const useDeleteEntry = (eventId: number) =>
  useEventMutation(eventId, (entryId: number) => deleteEntry(eventId, entryId));
