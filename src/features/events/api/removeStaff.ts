import type { StaffRole } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const removeStaff = (eventId: number, userId: number, role: StaffRole) =>
  send<void>(eventPath(eventId, `/staff/${userId}/${role}`), jsonBody('DELETE'));

export const useRemoveStaff = (eventId: number) =>
  useEventMutation(eventId, ({ userId, role }: { userId: number; role: StaffRole }) =>
    removeStaff(eventId, userId, role),
  );
