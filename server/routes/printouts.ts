import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { idParam } from '../http/params';
import { findSession } from '../services/organizer/sessions';
import { loadPrintSession } from '../services/printouts/printSession';
import { scorecardsPdf } from '../services/printouts/scorecards';
import { targetSheetsPdf } from '../services/printouts/targetSheets';

const fileName = (sessionName: string, what: string) =>
  `${what}-${
    sessionName
      .replace(/[^a-z0-9]+/gi, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'session'
  }.pdf`;

/** Printable scorecards and target sheets of a session (organizers print; judges may read them). */
export function printoutRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const staff = [ctx.requireUser, requireEventRole(db, 'organizer', 'judge')];

  async function send(req: Request, res: Response, what: 'scorecards' | 'target-sheets') {
    const session = await findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));
    const print = await loadPrintSession(db, session, ctx.linkAddress.url);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(session.name, what)}"`);
    // Streamed page by page: a session's printout never holds up other requests for long.
    if (what === 'scorecards') await scorecardsPdf(print, res);
    else await targetSheetsPdf(print, res);
  }

  router.get('/events/:eventId/sessions/:sessionId/scorecards.pdf', ...staff, (req, res) =>
    send(req, res, 'scorecards'),
  );
  router.get('/events/:eventId/sessions/:sessionId/target-sheets.pdf', ...staff, (req, res) =>
    send(req, res, 'target-sheets'),
  );

  return router;
}
