import { Router } from 'express';
import type { AppContext } from '../context';
import { validateBody } from '../http/validate';
import { mailFinalCards } from '../services/judging/finalCard';
import { waitingChangesFileSchema } from '../../src/contract/waitingChanges';
import { importWaitingChanges } from '../services/sync/importWaiting';
import { requireEventRole } from '../auth/eventRoles';
import { deviceKeyRequestSchema } from '../../src/contract/deviceKeys';
import { registerDeviceKey } from '../services/sync/deviceKeys';

/**
 * The field path's other routes: a judge bringing in a phone's saved changes, a phone registering
 * its key. The push and the pull are the field lane (syncLane.ts).
 */
export function syncRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  // A phone that cannot sync saves its changes as a file; a judge of the event brings them in.
  router.post(
    '/events/:eventId/waiting-changes',
    ctx.requireUser,
    requireEventRole(db, 'judge'),
    // The phone signed the bytes it saved; its signature is checked on the body as it arrived.
    (req, res, next) => {
      res.locals.rawBody = req.body as unknown;
      next();
    },
    validateBody(waitingChangesFileSchema),
    async (req, res) => {
      const eventId = Number(req.params.eventId);
      res.json(
        await importWaitingChanges(db, eventId, req.user!.id, req.body, res.locals.rawBody, {
          signingKeys: ctx.signingKeys,
          onFinalCards: (cards) => void mailFinalCards(db, ctx.mailer, cards, ctx.linkAddress.url),
        }),
      );
    },
  );

  router.post('/sync/device-key', ctx.requireUser, validateBody(deviceKeyRequestSchema), async (req, res) => {
    await registerDeviceKey(db, req.user!.id, req.body);
    res.status(204).end();
  });

  return router;
}
