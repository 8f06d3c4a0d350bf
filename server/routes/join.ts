import { Router } from 'express';
import { joinRequestSchema } from '../../src/contract/sync';
import type { AppContext } from '../context';
import { HttpError } from '../http/httpError';
import { JoinThrottle } from '../auth/joinThrottle';
import { tooManyAttempts } from '../auth/tooManyAttempts';
import { validateBody } from '../http/validate';
import { joinTarget } from '../services/sync/targetMembers';

/** Joining a target group with its code (the joined target itself: routes/targets.ts). */
export function joinRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
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

  return router;
}
