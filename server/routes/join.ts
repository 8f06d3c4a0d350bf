import { Router, type Request, type Response } from 'express';
import { matchJoinSchema, type MatchJoin } from '../../src/contract/matches';
import { joinRequestSchema, type JoinRequest } from '../../src/contract/sync';
import type { AppContext } from '../context';
import { HttpError } from '../http/httpError';
import { JoinThrottle } from '../auth/joinThrottle';
import { tooManyAttempts } from '../auth/tooManyAttempts';
import { validateBody } from '../http/validate';
import { joinMatch } from '../services/matches/matchWriters';
import { joinTarget } from '../services/sync/targetMembers';

/** Joining a target group, or a match's target, with its code (the joined target itself: routes/targets.ts). */
export function joinRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const throttle = new JoinThrottle();
  /** A code no target has (404) or a replaced one (410): what a guess gets. */
  const isWrongCode = (err: unknown) =>
    err instanceof HttpError && (err.status === 404 || err.status === 410);

  /** Runs one join attempt under the throttle: wrong codes count, a right one clears the count. */
  const throttled =
    <T>(attempt: (req: Request) => Promise<T>) =>
    async (req: Request, res: Response) => {
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
        res.json(await attempt(req));
        throttle.succeeded(keys);
      } catch (err) {
        if (isWrongCode(err)) throttle.failed(keys);
        throw err;
      }
    };

  router.post(
    '/join',
    ctx.requireUser,
    validateBody(joinRequestSchema),
    throttled((req) => joinTarget(db, req.user!.id, req.body as JoinRequest)),
  );
  /** A match's target: its archers (or named scorers) join with the match's code (docs/matches.md). */
  router.post(
    '/join/match',
    ctx.requireUser,
    validateBody(matchJoinSchema),
    throttled((req) => joinMatch(db, req.user!.id, (req.body as MatchJoin).code)),
  );

  return router;
}
