import { Router } from 'express';
import { divisionInputSchema } from '../../src/contract/events';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { createDivision, deleteDivision, listDivisions, updateDivision } from '../services/organizer/divisions';

/** Divisions of an event: a bow style and a class. Organizers change them; staff read them. */
export function divisionRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];

  router.get(
    '/events/:eventId/divisions',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge', 'archer'),
    async (req, res) => {
      res.json({ divisions: await listDivisions(db, Number(req.params.eventId)) });
    },
  );

  router.post(
    '/events/:eventId/divisions',
    ...organizer,
    validateBody(divisionInputSchema),
    async (req, res) => {
      res.status(201).json(await createDivision(db, req.user!.id, Number(req.params.eventId), req.body));
    },
  );

  router.put(
    '/events/:eventId/divisions/:divisionId',
    ...organizer,
    validateBody(divisionInputSchema),
    async (req, res) => {
      res.json(
        await updateDivision(
          db,
          req.user!.id,
          Number(req.params.eventId),
          idParam(req, 'divisionId', 'division'),
          req.body,
        ),
      );
    },
  );

  router.delete('/events/:eventId/divisions/:divisionId', ...organizer, async (req, res) => {
    await deleteDivision(
      db,
      req.user!.id,
      Number(req.params.eventId),
      idParam(req, 'divisionId', 'division'),
    );
    res.status(204).end();
  });

  return router;
}
