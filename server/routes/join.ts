import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER } from '../../src/contract/events';
import { joinRequestSchema } from '../../src/contract/sync';
import type { AppContext } from '../context';
import { HttpError, notFound } from '../http/httpError';
import { JoinThrottle } from '../auth/joinThrottle';
import { tooManyAttempts } from '../auth/tooManyAttempts';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { loadTargetPackage } from '../services/sync/targetPackage';
import { joinTarget, leaveTarget, targetViewerTask } from '../services/sync/targetMembers';
import { targetEndViews } from '../services/sync/targetEndViews';

/** Joining a target group with its code, the target's package, leaving, and the server's cross-check of its ends. */
export function joinRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const base = '/targets/:sessionId/:targetNumber';

  const target = (req: Request) => {
    const sessionId = idParam(req, 'sessionId', 'session');
    const targetNumber = idParam(req, 'targetNumber', 'target');
    if (targetNumber > MAX_TARGET_NUMBER) throw notFound('That target does not exist.');
    return { sessionId, targetNumber };
  };

  const throttle = new JoinThrottle();
  /** A code no target has (404) or a replaced one (410): what a guess gets. */
  const isWrongCode = (err: unknown) =>
    err instanceof HttpError && (err.status === 404 || err.status === 410);

  router.post('/join', ctx.requireUser, validateBody(joinRequestSchema), async (req, res) => {
    const keys = throttle.keys(req.user!.id, req.ip);
    const wait = throttle.waitMs(keys);
    if (wait > 0) {
      throw tooManyAttempts(
        res,
        wait,
        (time) => `Too many wrong join codes. Wait ${time}, then check the code against the target sheet.`,
      );
    }
    try {
      res.json(await joinTarget(db, req.user!.id, req.body));
      throttle.succeeded(keys);
    } catch (err) {
      if (isWrongCode(err)) throttle.failed(keys);
      throw err;
    }
  });

  router.get(base, ctx.requireUser, async (req, res) => {
    const { sessionId, targetNumber } = target(req);
    const task = await targetViewerTask(db, req.user!.id, sessionId, targetNumber);
    res.json(await loadTargetPackage(db, sessionId, targetNumber, task));
  });

  router.get(`${base}/ends`, ctx.requireUser, async (req, res) => {
    const { sessionId, targetNumber } = target(req);
    await targetViewerTask(db, req.user!.id, sessionId, targetNumber);
    res.json(await targetEndViews(db, sessionId, targetNumber));
  });

  router.post(`${base}/leave`, ctx.requireUser, async (req, res) => {
    const { sessionId, targetNumber } = target(req);
    await leaveTarget(db, req.user!.id, sessionId, targetNumber);
    res.status(204).end();
  });

  return router;
}
