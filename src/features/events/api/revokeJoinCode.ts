import type { TargetList } from '../../../contract/events';
import { jsonBody, send } from './eventKeys';
import { sessionPath, useTargetMutation } from './sessionTargets';

export const revokeJoinCode = (eventId: number, sessionId: number, targetNumber: number) =>
  send<TargetList>(sessionPath(eventId, sessionId, `/targets/${targetNumber}/join-code`), jsonBody('DELETE'));

export const useRevokeJoinCode = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (targetNumber: number) =>
    revokeJoinCode(eventId, sessionId, targetNumber),
  );
