import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER } from '../../src/contract/events';
import { PHOTO_MAX_BYTES } from '../../src/contract/judging';
import type { AppContext } from '../context';
import { requireEventRole, rolesInEvent } from '../auth/eventRoles';
import { verifyLimit } from '../auth/rateLimits';
import { badRequest, forbidden } from '../http/httpError';
import { idParam } from '../http/params';
import { photoUpload } from '../http/photoUpload';
import { loadCard, requireCardViewer } from '../services/judging/cardData';
import { cardView, sessionCards } from '../services/judging/cardViews';
import { sendFinalCard } from '../services/judging/finalCard';
import { judgeDesk } from '../services/judging/judgeDesk';
import { readPhoto, storePhoto } from '../services/judging/photos';
import { findSession } from '../services/organizer/sessions';
import { verifySignature } from '../services/signing/verify';

/**
 * The judges' side (see DEVELOPERS.md, "Judging and signatures"): the judge desk, the cards and
 * their countersignatures, the public verification of a signature, and photos of targets.
 * Rulings and signatures themselves are mutations and arrive through /api/sync/push.
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

  // Public: anyone holding a printed or mailed card may check it.
  router.get('/verify', verifyLimit(), async (req, res) => {
    const sig = req.query.sig;
    if (typeof sig !== 'string' || sig.trim() === '')
      throw badRequest('Give the signature to check as ?sig=… (the link in the QR code on the card has it).');
    res.setHeader('Cache-Control', 'no-store');
    res.json(await verifySignature(db, ctx.signingKeys, sig.trim()));
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
