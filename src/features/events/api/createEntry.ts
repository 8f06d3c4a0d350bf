import type { Entry, EntryInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const createEntry = (eventId: number, input: EntryInput) =>
  send<Entry>(eventPath(eventId, '/entries'), jsonBody('POST', input));

export const useCreateEntry = (eventId: number) =>
  useEventMutation(eventId, (input: EntryInput) => createEntry(eventId, input));
