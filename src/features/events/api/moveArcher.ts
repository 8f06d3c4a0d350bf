import type { MoveArcherInput, TargetList } from '../../../contract/events';
import { jsonBody, send } from './eventKeys';
import { sessionPath, useTargetMutation } from './sessionTargets';

export const moveArcher = (eventId: number, sessionId: number, input: MoveArcherInput) =>
  send<TargetList>(sessionPath(eventId, sessionId, '/assignments/move'), jsonBody('POST', input));

export const useMoveArcher = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (input: MoveArcherInput) => moveArcher(eventId, sessionId, input));
