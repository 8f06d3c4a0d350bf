import { Router } from 'express';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { idParam } from '../http/params';
import { cardBoard } from '../services/judging/cardBoard';
import { findSession } from '../services/organizer/sessions';

/**
 * The organizer's card board of a session: every card's state and the targets that are behind.
 * Sending a final card again is `POST /api/cards/:sessionId/:entryId/send`.
 */
export function cardBoardRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  router.get(
    '/events/:eventId/sessions/:sessionId/card-board',
    ctx.requireUser,
    requireEventRole(db, 'organizer'),
    async (req, res) => {
      const session = await findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));
      res.json(await cardBoard(db, session));
    },
  );
  return router;
}
