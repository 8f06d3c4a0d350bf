import { useMutation } from '@tanstack/react-query';
import type { ImportPreview } from '../../../contract/events';
import { eventPath, send } from '../../../api/eventKeys';

const csvForm = (file: File) => {
  const form = new FormData();
  form.append('file', file);
  return form;
};

/** Checks a CSV file on the server; nothing is stored. */
export const previewImport = (eventId: number, file: File) =>
  send<ImportPreview>(eventPath(eventId, '/entries/import/preview'), { method: 'POST', body: csvForm(file) });

export const usePreviewImport = (eventId: number) =>
  useMutation({ mutationFn: (file: File) => previewImport(eventId, file), networkMode: 'always' });
