import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const cancelInvitation = (eventId: number, invitationId: number) =>
  send<void>(eventPath(eventId, `/staff/invitations/${invitationId}`), jsonBody('DELETE'));

export const useCancelInvitation = (eventId: number) =>
  useEventMutation(eventId, (invitationId: number) => cancelInvitation(eventId, invitationId));
