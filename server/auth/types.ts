import type { EventRole } from '../../src/contract/auth';

export type AuthUser = { id: number; email: string; displayName: string; emailVerified: boolean };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by requireUser. */
      user?: AuthUser;
      /** Set by requireEventRole: the caller's roles in the event named by :eventId. */
      eventRoles?: EventRole[];
    }
  }
}
