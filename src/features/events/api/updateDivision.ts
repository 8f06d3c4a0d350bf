import type { Division, DivisionInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const updateDivision = (eventId: number, divisionId: number, input: DivisionInput) =>
  send<Division>(eventPath(eventId, `/divisions/${divisionId}`), jsonBody('PUT', input));

export const useUpdateDivision = (eventId: number) =>
  useEventMutation(eventId, ({ divisionId, ...input }: DivisionInput & { divisionId: number }) =>
    updateDivision(eventId, divisionId, input),
  );
