import { Router } from 'express';
import { createEventSchema, updateEventSchema } from '../../src/contract/events';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { validateBody } from '../http/validate';
import { createEvent, listEventsFor, loadEventSummary, updateEvent } from '../services/organizer/events';

/** Events: anyone signed in may create one (and becomes its organizer); each person sees their own. */
export function eventRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/events', ctx.requireUser, validateBody(createEventSchema), async (req, res) => {
    res.status(201).json(await createEvent(db, req.user!.id, req.body));
  });

  router.get('/events', ctx.requireUser, async (req, res) => {
    res.json(await listEventsFor(db, req.user!.id));
  });

  router.get(
    '/events/:eventId',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge', 'archer'),
    async (req, res) => {
      res.json(await loadEventSummary(db, Number(req.params.eventId), req.eventRoles ?? []));
    },
  );

  router.patch(
    '/events/:eventId',
    ctx.requireUser,
    requireEventRole(db, 'organizer'),
    validateBody(updateEventSchema),
    async (req, res) => {
      res.json(await updateEvent(db, req.user!.id, Number(req.params.eventId), req.body));
    },
  );

  return router;
}
