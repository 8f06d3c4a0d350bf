import type { TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

/** A code for every target that has archers but no code. */
export const createJoinCodes = (eventId: number, sessionId: number) =>
  send<TargetList>(sessionPath(eventId, sessionId, '/join-codes'), jsonBody('POST'));

export const useCreateJoinCodes = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, () => createJoinCodes(eventId, sessionId));
