import type { InviteStaffInput, PendingInvitation } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const inviteStaff = (eventId: number, input: InviteStaffInput) =>
  send<PendingInvitation>(eventPath(eventId, '/staff'), jsonBody('POST', input));

export const useInviteStaff = (eventId: number) =>
  useEventMutation(eventId, (input: InviteStaffInput) => inviteStaff(eventId, input));
