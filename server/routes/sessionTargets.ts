import { Router, type Request } from 'express';
import { MAX_TARGET_NUMBER, moveArcherSchema, swapArchersSchema } from '../../src/contract/events';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { notFound } from '../http/httpError';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { reissueJoinCode, revokeJoinCode } from '../services/organizer/joinCodes';
import { audit } from '../services/audit';
import { findSession } from '../services/organizer/sessions';
import {
  assignAutomatically,
  createMissingJoinCodes,
  moveArcher,
  swapArchers,
  unassignArcher,
} from '../services/organizer/targetAssignment';
import { loadTargetList } from '../services/organizer/targetLayout';

/** Target assignments and join codes of one session. Every change answers with the new layout. */
export function sessionTargetRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];
  const base = '/events/:eventId/sessions/:sessionId';

  const session = (req: Request) =>
    findSession(db, Number(req.params.eventId), idParam(req, 'sessionId', 'session'));
  const targetNumber = (req: Request) => {
    const n = idParam(req, 'targetNumber', 'target');
    if (n > MAX_TARGET_NUMBER) throw notFound('That target does not exist.');
    return n;
  };
  const layout = async (req: Request) => loadTargetList(db, await session(req), ctx.linkAddress);

  router.get(
    `${base}/targets`,
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge'),
    async (req, res) => {
      res.json(await layout(req));
    },
  );

  router.post(`${base}/assign`, ...organizer, async (req, res) => {
    const assigned = await assignAutomatically(db, req.user!.id, await session(req));
    res.json({ ...(await layout(req)), assigned });
  });

  router.post(`${base}/assignments/move`, ...organizer, validateBody(moveArcherSchema), async (req, res) => {
    await moveArcher(db, req.user!.id, await session(req), req.body);
    res.json(await layout(req));
  });

  router.post(`${base}/assignments/swap`, ...organizer, validateBody(swapArchersSchema), async (req, res) => {
    await swapArchers(db, req.user!.id, await session(req), req.body);
    res.json(await layout(req));
  });

  router.delete(`${base}/assignments/:entryId`, ...organizer, async (req, res) => {
    await unassignArcher(db, req.user!.id, await session(req), idParam(req, 'entryId', 'entry'));
    res.json(await layout(req));
  });

  router.post(`${base}/join-codes`, ...organizer, async (req, res) => {
    await createMissingJoinCodes(db, req.user!.id, await session(req));
    res.json(await layout(req));
  });

  router.post(`${base}/targets/:targetNumber/join-code`, ...organizer, async (req, res) => {
    const s = await session(req);
    const target = targetNumber(req);
    const { code, revoked } = await reissueJoinCode(db, s.id, target);
    await audit(db, {
      userId: req.user!.id,
      eventId: s.event_id,
      action: 'join_code.issued',
      details: { sessionId: s.id, target, code, revoked },
    });
    res.json(await layout(req));
  });

  router.delete(`${base}/targets/:targetNumber/join-code`, ...organizer, async (req, res) => {
    const s = await session(req);
    const target = targetNumber(req);
    const code = await revokeJoinCode(db, s.id, target);
    await audit(db, {
      userId: req.user!.id,
      eventId: s.event_id,
      action: 'join_code.revoked',
      details: { sessionId: s.id, target, code },
    });
    res.json(await layout(req));
  });

  return router;
}
