import type { EventSession, UpdateSessionInput } from '../../../contract/events';
import { eventPath, jsonBody, send, useEventMutation } from '../../../api/eventKeys';

export const updateSession = (eventId: number, sessionId: number, input: UpdateSessionInput) =>
  send<EventSession>(eventPath(eventId, `/sessions/${sessionId}`), jsonBody('PATCH', input));

export const useUpdateSession = (eventId: number) =>
  useEventMutation(eventId, ({ sessionId, ...input }: UpdateSessionInput & { sessionId: number }) =>
    updateSession(eventId, sessionId, input),
  );
