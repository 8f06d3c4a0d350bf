import type { Division, DivisionInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const createDivision = (eventId: number, input: DivisionInput) =>
  send<Division>(eventPath(eventId, '/divisions'), jsonBody('POST', input));

export const useCreateDivision = (eventId: number) =>
  useEventMutation(eventId, (input: DivisionInput) => createDivision(eventId, input));
