import type { SwapArchersInput, TargetList } from '../../../contract/events';
import { jsonBody, send } from './eventKeys';
import { sessionPath, useTargetMutation } from './sessionTargets';

export const swapArchers = (eventId: number, sessionId: number, input: SwapArchersInput) =>
  send<TargetList>(sessionPath(eventId, sessionId, '/assignments/swap'), jsonBody('POST', input));

export const useSwapArchers = (eventId: number, sessionId: number) =>
  useTargetMutation(eventId, sessionId, (input: SwapArchersInput) => swapArchers(eventId, sessionId, input));
