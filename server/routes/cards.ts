import { Router, type Request } from 'express';
import type { AppContext } from '../context';
import { rolesInEvent } from '../auth/eventRoles';
import { forbidden } from '../http/httpError';
import { idParam } from '../http/params';
import { loadCard, requireCardViewer } from '../services/judging/cardData';
import { cardView } from '../services/judging/cardViews';
import { sendFinalCard } from '../services/judging/finalCard';

/** One archer's card in a session: who may read it, and the organizer sending the final card again. */
export function cardRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const card = (req: Request) =>
    loadCard(db, idParam(req, 'sessionId', 'session'), idParam(req, 'entryId', 'archer'));

  router.get('/cards/:sessionId/:entryId', ctx.requireUser, async (req, res) => {
    const data = await card(req);
    const relation = await requireCardViewer(db, req.user!.id, data);
    res.setHeader('Cache-Control', 'no-store');
    res.json(cardView(data, relation));
  });

  router.post('/cards/:sessionId/:entryId/send', ctx.requireUser, async (req, res) => {
    const data = await card(req);
    const roles = await rolesInEvent(db, req.user!.id, data.event.id);
    if (!roles.includes('organizer'))
      throw forbidden("Only the event's organizers can send a final card again.");
    res.json(
      await sendFinalCard(
        db,
        ctx.mailer,
        data.session.id,
        data.archer.entryId,
        ctx.linkAddress.url,
        req.user!.id,
      ),
    );
  });

  return router;
}
