import type { MoveArcherInput, TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

export const moveArcher = (eventId: number, sessionId: number, input: MoveArcherInput) =>
  send<TargetList>(sessionPath(eventId, sessionId, '/assignments/move'), jsonBody('POST', input));

export const useMoveArcher = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (input: MoveArcherInput) => moveArcher(eventId, sessionId, input));
