import type { ImportRowsInput } from '../../../contract/entryImport';
import type { ImportResult } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

/** Imports the rows as corrected in the preview, or nothing (the server refuses with the problems). */
export const importEntries = (eventId: number, input: ImportRowsInput) =>
  send<ImportResult>(eventPath(eventId, '/entries/import'), jsonBody('POST', input));

export const useImportEntries = (eventId: number) =>
  useEventMutation(eventId, (input: ImportRowsInput) => importEntries(eventId, input));
