import { Router, type RequestHandler } from 'express';
import type { AppContext } from '../context';
import { rolesInEvent } from '../auth/eventRoles';
import { forbidden, notFound, unauthorized } from '../http/httpError';
import { idParam } from '../http/params';
import { archerPlace } from '../services/results/archerPlace';
import { resultsCache } from '../services/results/resultsCache';
import { findResultsEvent } from '../services/results/resultsEvent';

/**
 * An archer's live place for their phone (home screen and card): the standings' own row with the
 * gaps around it. Before the results are published, only the archer and the event's organizers
 * and judges may read it: another archer learns nothing of someone else's place.
 */
export function archerPlaceRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const cache = resultsCache(db);
  const maybeUser: RequestHandler = (req, res, next) =>
    req.get('authorization') ? ctx.requireUser(req, res, next) : next();

  router.get('/places/:sessionId/:entryId', maybeUser, async (req, res) => {
    const sessionId = idParam(req, 'sessionId', 'session');
    const entryId = idParam(req, 'entryId', 'archer');
    const entry = (await db('target_assignments as ta')
      .join('entries as e', 'e.id', 'ta.entry_id')
      .where({ 'ta.session_id': sessionId, 'ta.entry_id': entryId })
      .first('e.event_id', 'e.user_id')) as { event_id: number; user_id: number | null } | undefined;
    if (!entry) throw notFound('This archer has no place in that session.');
    const event = await findResultsEvent(db, entry.event_id);
    if (!event.published) {
      const userId = req.user?.id;
      if (userId === undefined)
        throw unauthorized('The results of this event are not published yet. Sign in to see your place.');
      const staff = (await rolesInEvent(db, userId, event.id)).some(
        (r) => r === 'organizer' || r === 'judge',
      );
      if (!staff && entry.user_id !== userId)
        throw forbidden(
          'The results of this event are not published yet: each archer sees only their own place.',
        );
    }
    res.setHeader('Cache-Control', 'no-store');
    res.json(archerPlace(await cache.results(event, await cache.version(event)), sessionId, entryId));
  });
  return router;
}
