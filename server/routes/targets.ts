import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER } from '../../src/contract/events';
import type { AppContext } from '../context';
import { notFound } from '../http/httpError';
import { idParam } from '../http/params';
import { loadTargetPackage } from '../services/sync/targetPackage';
import { loadSessionPackages } from '../services/sync/sessionPackages';
import { leaveTarget, targetViewerTask } from '../services/sync/targetMembers';
import { targetEndViews } from '../services/sync/targetEndViews';

/** A session's targets for the judge desk; a joined target on the field: its package, the server's cross-check of its ends, and leaving it. */
export function targetRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const base = '/targets/:sessionId/:targetNumber';

  const target = (req: Request) => {
    const sessionId = idParam(req, 'sessionId', 'session');
    const targetNumber = idParam(req, 'targetNumber', 'target');
    if (targetNumber > MAX_TARGET_NUMBER) throw notFound('That target does not exist.');
    return { sessionId, targetNumber };
  };

  router.get('/targets/:sessionId', ctx.requireUser, async (req, res) => {
    res.json(await loadSessionPackages(db, req.user!.id, idParam(req, 'sessionId', 'session')));
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
