import { Router, type Request, type RequestHandler } from 'express';
import { resultsSendSchema, resultsSettingsSchema } from '../../src/contract/results';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { notFound } from '../http/httpError';
import { divisionQuery, idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { eventBrackets } from '../services/matches/bracketView';
import { finalPlacesOf } from '../services/results/bracketPlaces';
import { resultsCache } from '../services/results/resultsCache';
import { resultsCsv } from '../services/results/resultsCsv';
import {
  findResultsEvent,
  requireResultsPrinter,
  requireResultsViewer,
  type ResultsEvent,
} from '../services/results/resultsEvent';
import { resultsPdf } from '../services/results/resultsPdf';
import { updateResultsSettings } from '../services/results/resultsSettings';
import { sendResults } from '../services/results/sendResults';

/**
 * Results: the standings of an event (public once the organizer publishes them; before that for
 * its organizers, judges and archers), as JSON with an ETag, as CSV or as a PDF (before publishing
 * for organizers only), the organizer's "send results" mail to every entrant, and the organizer's
 * results settings. Shoot-off arrows arrive as mutations through /api/sync/push.
 */
export function resultsRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const cache = resultsCache(db);
  // Signed-in people see unpublished results of their own events; nobody has to be signed in.
  const maybeUser: RequestHandler = (req, res, next) =>
    req.get('authorization') ? ctx.requireUser(req, res, next) : next();

  const readable = async (req: Request) => {
    const event = await findResultsEvent(db, idParam(req, 'eventId', 'event'));
    await requireResultsViewer(db, event, req.user?.id);
    return event;
  };

  router.get('/results/:eventId', maybeUser, async (req, res) => {
    const event = await readable(req);
    const version = await cache.version(event);
    // Who may read is checked above; the tag only says whether the standings changed.
    const etag = `"results-${event.id}-${version}"`;
    res.setHeader('ETag', etag);
    res.setHeader('Cache-Control', 'no-cache');
    if (req.get('if-none-match') === etag) {
      res.status(304).end();
      return;
    }
    res.json(await cache.results(event, version));
  });

  /** The standings now, and the one division `?division=ID` names (none: the whole event). */
  const standingsOf = async (req: Request, event: ResultsEvent) => {
    const divisionId = divisionQuery(req);
    const results = await cache.results(event, await cache.version(event));
    const known = results.sessions.some((s) => s.divisions.some((d) => d.divisionId === divisionId));
    if (divisionId !== undefined && !known) throw notFound('That division has no standings in this event.');
    const name = `results-${event.id}${divisionId ? `-division-${divisionId}` : ''}`;
    const finals = finalPlacesOf(await eventBrackets(db, event.id), divisionId);
    return { results, divisionId, name, finals };
  };

  router.get('/results/:eventId/csv', maybeUser, async (req, res) => {
    const { results, divisionId, name, finals } = await standingsOf(req, await readable(req));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${name}.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(resultsCsv(results, divisionId, finals));
  });

  router.get('/results/:eventId/pdf', maybeUser, async (req, res) => {
    const event = await findResultsEvent(db, idParam(req, 'eventId', 'event'));
    await requireResultsPrinter(db, event, req.user?.id);
    const { results, divisionId, name, finals } = await standingsOf(req, event);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${name}.pdf"`);
    res.setHeader('Cache-Control', 'no-store');
    // Streamed page by page, as the other printouts: a long field never holds up other requests.
    await resultsPdf(results, res, divisionId, finals);
  });

  router.patch(
    '/events/:eventId/results-settings',
    ctx.requireUser,
    requireEventRole(db, 'organizer'),
    validateBody(resultsSettingsSchema),
    async (req, res) => {
      const eventId = Number(req.params.eventId);
      await updateResultsSettings(db, eventId, req.user!.id, req.body);
      const event = await findResultsEvent(db, eventId);
      res.json(await cache.results(event, await cache.version(event)));
    },
  );
  router.post(
    '/events/:eventId/results/send',
    ctx.requireUser,
    requireEventRole(db, 'organizer'),
    validateBody(resultsSendSchema),
    async (req, res) => {
      const event = await findResultsEvent(db, idParam(req, 'eventId', 'event'));
      const results = await cache.results(event, await cache.version(event));
      const pageUrl = `${ctx.linkAddress.url}/results/${event.id}`;
      const finals = finalPlacesOf(await eventBrackets(db, event.id));
      res.json(await sendResults(db, ctx.mailer, results, { userId: req.user!.id, pageUrl }, finals));
    },
  );
  return router;
}
