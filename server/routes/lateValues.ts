import { Router, type Request } from 'express';
import { rejectLateValueSchema } from '../../src/contract/lateValues';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { sessionCloseCheck } from '../services/organizer/sessionCloseCheck';
import { findSession } from '../services/organizer/sessions';
import { acceptLateValue, listLateValues, rejectLateValue } from '../services/sync/lateValues';

/**
 * Closing a session without losing what is still on phones: the organizer's check before closing,
 * and the late values (arrived after closing) that a judge accepts or rejects.
 */
export function lateValueRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const session = (req: Request) =>
    findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));
  const judge = [ctx.requireUser, requireEventRole(db, 'judge')];

  router.get(
    '/events/:eventId/sessions/:sessionId/close-check',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge'),
    async (req, res) => {
      res.setHeader('Cache-Control', 'no-store');
      res.json(await sessionCloseCheck(db, await session(req)));
    },
  );

  router.get(
    '/events/:eventId/sessions/:sessionId/late-values',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge'),
    async (req, res) => {
      res.setHeader('Cache-Control', 'no-store');
      res.json(await listLateValues(db, (await session(req)).id));
    },
  );

  router.post('/events/:eventId/late-values/:lateId/accept', ...judge, async (req, res) => {
    await acceptLateValue(db, req.user!.id, Number(req.params.eventId), idParam(req, 'lateId', 'late value'));
    res.status(204).end();
  });

  router.post(
    '/events/:eventId/late-values/:lateId/reject',
    ...judge,
    validateBody(rejectLateValueSchema),
    async (req, res) => {
      await rejectLateValue(
        db,
        req.user!.id,
        Number(req.params.eventId),
        idParam(req, 'lateId', 'late value'),
        req.body.reason,
      );
      res.status(204).end();
    },
  );

  return router;
}
