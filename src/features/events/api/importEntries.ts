import type { ImportResult } from '../../../contract/events';
import { eventPath, send, useEventMutation } from '../../../api/eventKeys';
import { csvForm } from './previewImport';

/** Imports the whole file, or nothing (the server refuses with the problems). */
export const importEntries = (eventId: number, file: File) =>
  send<ImportResult>(eventPath(eventId, '/entries/import'), { method: 'POST', body: csvForm(file) });

export const useImportEntries = (eventId: number) =>
  useEventMutation(eventId, (file: File) => importEntries(eventId, file));
