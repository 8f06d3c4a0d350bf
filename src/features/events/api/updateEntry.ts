import type { Entry, UpdateEntryInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const updateEntry = (eventId: number, entryId: number, input: UpdateEntryInput) =>
  send<Entry>(eventPath(eventId, `/entries/${entryId}`), jsonBody('PATCH', input));

export const useUpdateEntry = (eventId: number) =>
  useEventMutation(eventId, ({ entryId, ...input }: UpdateEntryInput & { entryId: number }) =>
    updateEntry(eventId, entryId, input),
  );
