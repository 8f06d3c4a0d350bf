import type { TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

export const unassignArcher = (eventId: number, sessionId: number, entryId: number) =>
  send<TargetList>(sessionPath(eventId, sessionId, `/assignments/${entryId}`), jsonBody('DELETE'));

export const useUnassignArcher = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (entryId: number) => unassignArcher(eventId, sessionId, entryId));
