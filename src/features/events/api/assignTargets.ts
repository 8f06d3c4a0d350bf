import type { AssignResult } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

/** Replaces the session's layout with the automatic one. */
export const assignTargets = (eventId: number, sessionId: number) =>
  send<AssignResult>(sessionPath(eventId, sessionId, '/assign'), jsonBody('POST'));

export const useAssignTargets = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, () => assignTargets(eventId, sessionId));
