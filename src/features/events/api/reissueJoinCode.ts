import type { TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

/** Revokes the target's code (if any) and issues a new one. */
export const reissueJoinCode = (eventId: number, sessionId: number, targetNumber: number) =>
  send<TargetList>(sessionPath(eventId, sessionId, `/targets/${targetNumber}/join-code`), jsonBody('POST'));

export const useReissueJoinCode = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (targetNumber: number) =>
    reissueJoinCode(eventId, sessionId, targetNumber),
  );
