import { Router } from 'express';
import { acceptInvitationSchema } from '../../src/contract/auth';
import type { AppContext } from '../context';
import { validateBody } from '../http/validate';
import { acceptInvitation } from '../services/accounts';

/** A signed-in person takes up an invitation to an event's staff, with the mailed link's token. */
export function invitationRoutes(ctx: AppContext): Router {
  const router = Router();
  router.post(
    '/invitations/accept',
    ctx.requireUser,
    validateBody(acceptInvitationSchema),
    async (req, res) => {
      res.json(await acceptInvitation(ctx.db, req.body.token, req.user!.id));
    },
  );
  return router;
}
