import { Router, type Request } from 'express';
import { sessionInputSchema, updateSessionSchema } from '../../src/contract/events';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import {
  createSession,
  deleteSession,
  listSessions,
  setSessionClosed,
  updateSession,
} from '../services/organizer/sessions';

/** Sessions of shooting and the round each division shoots in them. */
export function sessionRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];
  const ids = (req: Request) => ({
    eventId: Number(req.params.eventId),
    sessionId: idParam(req, 'sessionId', 'session'),
  });

  router.get(
    '/events/:eventId/sessions',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge', 'archer'),
    async (req, res) => {
      res.json({ sessions: await listSessions(db, Number(req.params.eventId)) });
    },
  );

  router.post(
    '/events/:eventId/sessions',
    ...organizer,
    validateBody(sessionInputSchema),
    async (req, res) => {
      res.status(201).json(await createSession(db, req.user!.id, Number(req.params.eventId), req.body));
    },
  );

  router.patch(
    '/events/:eventId/sessions/:sessionId',
    ...organizer,
    validateBody(updateSessionSchema),
    async (req, res) => {
      const { eventId, sessionId } = ids(req);
      res.json(await updateSession(db, req.user!.id, eventId, sessionId, req.body));
    },
  );

  router.delete('/events/:eventId/sessions/:sessionId', ...organizer, async (req, res) => {
    const { eventId, sessionId } = ids(req);
    await deleteSession(db, req.user!.id, eventId, sessionId);
    res.status(204).end();
  });

  router.post('/events/:eventId/sessions/:sessionId/close', ...organizer, async (req, res) => {
    const { eventId, sessionId } = ids(req);
    res.json(await setSessionClosed(db, req.user!.id, eventId, sessionId, true));
  });

  router.post('/events/:eventId/sessions/:sessionId/reopen', ...organizer, async (req, res) => {
    const { eventId, sessionId } = ids(req);
    res.json(await setSessionClosed(db, req.user!.id, eventId, sessionId, false));
  });

  return router;
}
