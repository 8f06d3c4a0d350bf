import { Router, type NextFunction, type Request, type Response } from 'express';
import {
  MATCH_END_INDEX_MAX,
  bracketSettingsSchema,
  createBracketSchema,
  matchEndSchema,
  matchScorerSchema,
  matchShootOffSchema,
  matchTargetSchema,
  matchWalkoverSchema,
} from '../../src/contract/matches';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { badRequest, notFound } from '../http/httpError';
import { divisionQuery, idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { bracketPdf } from '../services/matches/bracketPdf';
import { eventBrackets } from '../services/matches/bracketView';
import { signMatchEnd } from '../services/matches/endSignatures';
import { createBracket } from '../services/matches/createBracket';
import {
  placeMatch,
  recordMatchEnd,
  recordMatchShootOff,
  recordWalkover,
  signMatch,
} from '../services/matches/matchActions';
import { matchJoinCodes } from '../services/matches/matchJoinCodes';
import { matchPad, setMatchScorer } from '../services/matches/matchWriters';
import { setBracketAlternation } from '../services/matches/shootingOrder';
import { findResultsEvent, requireResultsViewer } from '../services/results/resultsEvent';

/**
 * Eliminations: brackets are seen like the results (public once published); organizers create
 * them, set which matches alternate, place matches on targets and record withdrawals and no-shows; judges record the ends and
 * shoot-off arrows of a match and sign its ends and the match, which moves the bracket on.
 */
export function matchRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];
  const judge = [ctx.requireUser, requireEventRole(db, 'judge')];
  const ids = (req: Request) => ({
    eventId: Number(req.params.eventId),
    matchId: idParam(req, 'matchId', 'match'),
  });
  const answer = async (eventId: number) => ({ brackets: await eventBrackets(db, eventId) });
  const endIndexParam = (req: Request) => {
    const raw = String(req.params.endIndex);
    const endIndex = Number(raw);
    if (!/^\d$/.test(raw) || endIndex > MATCH_END_INDEX_MAX) {
      throw badRequest(`A match has ends 0 to ${MATCH_END_INDEX_MAX}.`);
    }
    return endIndex;
  };

  const maybeUser = (req: Request, res: Response, next: NextFunction) =>
    req.get('authorization') ? ctx.requireUser(req, res, next) : next();
  router.get('/events/:eventId/brackets', maybeUser, async (req, res) => {
    const event = await findResultsEvent(db, idParam(req, 'eventId', 'event'));
    await requireResultsViewer(db, event, req.user?.id);
    res.json(await answer(event.id));
  });

  /** The brackets as a PDF, seen like the brackets themselves; `?division=ID` prints one. */
  router.get('/events/:eventId/brackets/pdf', maybeUser, async (req, res) => {
    const event = await findResultsEvent(db, idParam(req, 'eventId', 'event'));
    await requireResultsViewer(db, event, req.user?.id);
    let brackets = await eventBrackets(db, event.id);
    const divisionId = divisionQuery(req);
    if (divisionId !== undefined) {
      brackets = brackets.filter((b) => b.divisionId === divisionId);
      if (brackets.length === 0) throw notFound('That division has no bracket in this event.');
    }
    const name = `eliminations-${event.id}${divisionId !== undefined ? `-division-${divisionId}` : ''}`;
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${name}.pdf"`);
    res.setHeader('Cache-Control', 'no-store');
    await bracketPdf(brackets, event, res);
  });

  router.post(
    '/events/:eventId/brackets',
    ...organizer,
    validateBody(createBracketSchema),
    async (req, res) => {
      const eventId = Number(req.params.eventId);
      await createBracket(db, eventId, req.user!.id, req.body);
      res.status(201).json(await answer(eventId));
    },
  );

  /** Which of the bracket's matches are shot alternately. */
  router.patch(
    '/events/:eventId/brackets/:bracketId',
    ...organizer,
    validateBody(bracketSettingsSchema),
    async (req, res) => {
      const eventId = Number(req.params.eventId);
      const bracketId = idParam(req, 'bracketId', 'bracket');
      await setBracketAlternation(db, eventId, bracketId, req.body.alternate, req.user!.id);
      res.json(await answer(eventId));
    },
  );

  router.patch(
    '/events/:eventId/matches/:matchId/target',
    ...organizer,
    validateBody(matchTargetSchema),
    async (req, res) => {
      const { eventId, matchId } = ids(req);
      await placeMatch(db, eventId, matchId, req.body.targetNumber);
      res.json(await answer(eventId));
    },
  );

  router.post(
    '/events/:eventId/matches/:matchId/walkover',
    ...organizer,
    validateBody(matchWalkoverSchema),
    async (req, res) => {
      const { eventId, matchId } = ids(req);
      await recordWalkover(db, eventId, matchId, req.body, req.user!.id);
      res.json(await answer(eventId));
    },
  );

  router.put(
    '/events/:eventId/matches/:matchId/ends/:endIndex',
    ...judge,
    validateBody(matchEndSchema),
    async (req, res) => {
      const { eventId, matchId } = ids(req);
      await recordMatchEnd(db, eventId, matchId, endIndexParam(req), req.body, req.user!.id);
      res.json(await answer(eventId));
    },
  );

  /** The judge signs one set or end that counts; it is closed to the writers. */
  router.post('/events/:eventId/matches/:matchId/ends/:endIndex/sign', ...judge, async (req, res) => {
    const { eventId, matchId } = ids(req);
    await signMatchEnd(db, eventId, matchId, endIndexParam(req), req.user!.id);
    res.json(await answer(eventId));
  });

  router.put(
    '/events/:eventId/matches/:matchId/shoot-off',
    ...judge,
    validateBody(matchShootOffSchema),
    async (req, res) => {
      const { eventId, matchId } = ids(req);
      await recordMatchShootOff(db, eventId, matchId, req.body, req.user!.id);
      res.json(await answer(eventId));
    },
  );

  router.post('/events/:eventId/matches/:matchId/sign', ...judge, async (req, res) => {
    const { eventId, matchId } = ids(req);
    await signMatch(db, eventId, matchId, req.user!.id);
    res.json(await answer(eventId));
  });

  /** The join codes of the open matches whose archers are known (made when first asked for). */
  router.get('/events/:eventId/matches/join-codes', ...organizer, async (req, res) => {
    res.json({ codes: await matchJoinCodes(db, Number(req.params.eventId)) });
  });

  /** The organizer names a scorer to write for one line of a match in place of its archer. */
  router.put(
    '/events/:eventId/matches/:matchId/scorers',
    ...organizer,
    validateBody(matchScorerSchema),
    async (req, res) => {
      const { eventId, matchId } = ids(req);
      await setMatchScorer(db, eventId, matchId, req.body, req.user!.id);
      res.status(204).end();
    },
  );

  /** A match writer's pad: the match as the server holds it, for those who joined it only. */
  router.get('/events/:eventId/matches/:matchId/pad', ctx.requireUser, async (req, res) => {
    const { matchId } = ids(req);
    res.json(await matchPad(db, idParam(req, 'eventId', 'event'), matchId, req.user!.id));
  });
  return router;
}
