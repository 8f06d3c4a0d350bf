import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER } from '../../src/contract/events';
import { PHOTO_MAX_BYTES } from '../../src/contract/judging';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { badRequest } from '../http/httpError';
import { idParam } from '../http/params';
import { photoUpload } from '../http/photoUpload';
import { sessionCards } from '../services/judging/cardViews';
import { judgeDesk } from '../services/judging/judgeDesk';
import { readPhoto, storePhoto } from '../services/judging/photos';
import { findSession } from '../services/organizer/sessions';

/**
 * The judges' side of a session (docs/judging.md): the judge desk, the session's cards, and photos
 * of targets. One card is routes/cards.ts, the public signature check routes/verify.ts; rulings and
 * signatures themselves are mutations and arrive through /api/sync/push.
 */
export function judgingRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const staff = [ctx.requireUser, requireEventRole(db, 'organizer', 'judge')];
  const session = (req: Request) =>
    findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));

  router.get('/events/:eventId/sessions/:sessionId/judge-desk', ...staff, async (req, res) => {
    const raw = req.query.target;
    let target: number | undefined;
    if (raw !== undefined) {
      target = typeof raw === 'string' && /^\d{1,3}$/.test(raw) ? Number(raw) : NaN;
      if (!(target >= 1 && target <= MAX_TARGET_NUMBER))
        throw badRequest(`target must be a target number from 1 to ${MAX_TARGET_NUMBER}.`);
    }
    res.json(await judgeDesk(db, await session(req), target));
  });

  router.get('/events/:eventId/sessions/:sessionId/cards', ...staff, async (req, res) => {
    res.json(await sessionCards(db, await session(req)));
  });

  router.post('/events/:eventId/photos', ...staff, photoUpload(PHOTO_MAX_BYTES), async (req, res) => {
    const { created, result } = await storePhoto(
      db,
      ctx.dataDir,
      req.user!.id,
      Number(req.params.eventId),
      req.file!.buffer,
    );
    res.status(created ? 201 : 200).json(result);
  });

  router.get('/photos/:photoId', ctx.requireUser, async (req, res) => {
    const photoId = idParam(req, 'photoId', 'photo');
    const photo = await readPhoto(db, ctx.dataDir, req.user!.id, photoId);
    res.setHeader('Content-Type', photo.mime);
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', `inline; filename="${photo.name}"`);
    res.send(photo.bytes);
  });

  return router;
}
