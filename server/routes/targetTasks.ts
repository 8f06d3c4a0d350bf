import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER } from '../../src/contract/events';
import { setMemberTaskSchema } from '../../src/contract/targetTasks';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { notFound } from '../http/httpError';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { findSession } from '../services/organizer/sessions';
import { setMemberTask, targetMembers } from '../services/sync/targetTasks';

/** Organizers and judges see who keeps which task on a target, and free or reassign a task. */
export function targetTaskRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const staff = [ctx.requireUser, requireEventRole(db, 'organizer', 'judge')];
  const base = '/events/:eventId/sessions/:sessionId/targets/:targetNumber/members';
  const place = async (req: Request) => {
    const session = await findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));
    const targetNumber = idParam(req, 'targetNumber', 'target');
    if (targetNumber > MAX_TARGET_NUMBER) throw notFound('That target does not exist.');
    return { session, targetNumber };
  };

  router.get(base, ...staff, async (req, res) => {
    const { session, targetNumber } = await place(req);
    res.setHeader('Cache-Control', 'no-store');
    res.json(await targetMembers(db, session.id, targetNumber));
  });

  router.put(`${base}/:userId`, ...staff, validateBody(setMemberTaskSchema), async (req, res) => {
    const { session, targetNumber } = await place(req);
    const memberId = idParam(req, 'userId', 'person');
    res.json(await setMemberTask(db, req.user!.id, session, targetNumber, memberId, req.body));
  });

  return router;
}
