import { Router, type RequestHandler } from 'express';
import {
  PUSH_MAX_CHANGES,
  pullQuerySchema,
  pushRequestSchema,
  type ReceivedPush,
} from '../../src/contract/sync';
import type { AppContext } from '../context';
import { HttpError, badRequest } from '../http/httpError';
import { describeIssues, validateBody } from '../http/validate';
import { pullChanges } from '../services/sync/pullChanges';
import { pushAndPull } from '../services/sync/pushAndPull';
import { mailFinalCards } from '../services/judging/finalCard';
import { waitingChangesFileSchema } from '../../src/contract/waitingChanges';
import { importWaitingChanges } from '../services/sync/importWaiting';
import { requireEventRole } from '../auth/eventRoles';
import { deviceKeyRequestSchema } from '../../src/contract/deviceKeys';
import { registerDeviceKey } from '../services/sync/deviceKeys';

/** More changes than one push takes: 413, which tells the phone to send its batch in halves. */
const refuseLargeBatch: RequestHandler = (req, _res, next) => {
  const changes = (req.body as { mutations?: unknown } | undefined)?.mutations;
  next(
    Array.isArray(changes) && changes.length > PUSH_MAX_CHANGES
      ? new HttpError(413, 'too_large', `Send at most ${PUSH_MAX_CHANGES} changes at once.`)
      : undefined,
  );
};

/** The field path: phones push their mutations and pull what changed (see DEVELOPERS.md, "The field loop"). */
export function syncRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post(
    '/sync/push',
    ctx.requireFieldUser,
    refuseLargeBatch,
    validateBody(pushRequestSchema),
    async (req, res) => {
      res.json(
        await pushAndPull(db, req.user!.id, req.body as ReceivedPush, {
          signingKeys: ctx.signingKeys,
          // Mailed after the push is committed, without holding up its answer.
          onFinalCards: (cards) => void mailFinalCards(db, ctx.mailer, cards, ctx.linkAddress.url),
        }),
      );
    },
  );

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

  router.get('/sync/pull', ctx.requireFieldUser, async (req, res) => {
    const query = pullQuerySchema.safeParse(req.query);
    if (!query.success) {
      const fields = describeIssues(query.error.issues);
      throw badRequest(
        `The request was not accepted. ${fields.map((f) => `${f.path}: ${f.message}`).join('; ')}`,
        fields,
      );
    }
    res.json(await pullChanges(db, req.user!.id, query.data));
  });

  return router;
}
