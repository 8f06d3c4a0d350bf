import type { SwapArchersInput, TargetList } from '../../../contract/events';
import { jsonBody, send } from '../../../api/eventKeys';
import { sessionPath, useTargetMutation } from '../../../api/sessionTargets';

export const swapArchers = (eventId: number, sessionId: number, input: SwapArchersInput) =>
  send<TargetList>(sessionPath(eventId, sessionId, '/assignments/swap'), jsonBody('POST', input));

export const useSwapArchers = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (input: SwapArchersInput) => swapArchers(eventId, sessionId, input));
