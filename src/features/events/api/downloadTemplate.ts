import { useMutation } from '@tanstack/react-query';
import { eventPath } from '../../../api/eventKeys';
import { downloadFile } from '../../../api/downloadFile';

export const downloadTemplate = (eventId: number) =>
  downloadFile(eventPath(eventId, '/entries/template.csv'), 'ringcall-entries.csv');

export const useDownloadTemplate = (eventId: number) =>
  useMutation({ mutationFn: () => downloadTemplate(eventId), networkMode: 'always' });
