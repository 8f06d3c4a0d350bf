import { useMutation } from '@tanstack/react-query';
import { downloadFile } from '../../../api/downloadFile';
import { sessionPath } from '../../../api/sessionTargets';

export const downloadScorecards = (eventId: number, sessionId: number) =>
  downloadFile(sessionPath(eventId, sessionId, '/scorecards.pdf'), `scorecards-session-${sessionId}.pdf`);

export const useDownloadScorecards = (eventId: number, sessionId: number) =>
  useMutation({ mutationFn: () => downloadScorecards(eventId, sessionId), networkMode: 'always' });
