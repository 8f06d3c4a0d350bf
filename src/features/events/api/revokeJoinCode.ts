import type { TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

export const revokeJoinCode = (eventId: number, sessionId: number, targetNumber: number) =>
  send<TargetList>(sessionPath(eventId, sessionId, `/targets/${targetNumber}/join-code`), jsonBody('DELETE'));

export const useRevokeJoinCode = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (targetNumber: number) =>
    revokeJoinCode(eventId, sessionId, targetNumber),
  );
