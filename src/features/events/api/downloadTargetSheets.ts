import { useMutation } from '@tanstack/react-query';
import { downloadFile } from '../../../api/downloadFile';
import { sessionPath } from '../../../api/sessionTargets';

export const downloadTargetSheets = (eventId: number, sessionId: number) =>
  downloadFile(
    sessionPath(eventId, sessionId, '/target-sheets.pdf'),
    `target-sheets-session-${sessionId}.pdf`,
  );

export const useDownloadTargetSheets = (eventId: number, sessionId: number) =>
  useMutation({ mutationFn: () => downloadTargetSheets(eventId, sessionId), networkMode: 'always' });
