import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const deleteDivision = (eventId: number, divisionId: number) =>
  send<void>(eventPath(eventId, `/divisions/${divisionId}`), jsonBody('DELETE'));

export const useDeleteDivision = (eventId: number) =>
  useEventMutation(eventId, (divisionId: number) => deleteDivision(eventId, divisionId));
