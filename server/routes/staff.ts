import { Router } from 'express';
import { inviteStaffSchema, staffRoleSchema } from '../../src/contract/events';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { notFound } from '../http/httpError';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { cancelInvitation, inviteStaff, listStaff, removeStaffRole } from '../services/organizer/staff';

/** Organizers and judges: invited by e-mail, listed with pending invitations, removed by role. */
export function staffRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];

  router.get(
    '/events/:eventId/staff',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge'),
    async (req, res) => {
      res.json(await listStaff(db, Number(req.params.eventId)));
    },
  );

  router.post('/events/:eventId/staff', ...organizer, validateBody(inviteStaffSchema), async (req, res) => {
    const invitation = await inviteStaff(db, ctx.mailer, {
      ...req.body,
      eventId: Number(req.params.eventId),
      invitedBy: { id: req.user!.id, displayName: req.user!.displayName },
      baseUrl: ctx.linkAddress.url,
    });
    res.status(201).json(invitation);
  });

  router.delete('/events/:eventId/staff/invitations/:invitationId', ...organizer, async (req, res) => {
    await cancelInvitation(
      db,
      req.user!.id,
      Number(req.params.eventId),
      idParam(req, 'invitationId', 'invitation'),
    );
    res.status(204).end();
  });

  router.delete('/events/:eventId/staff/:userId/:role', ...organizer, async (req, res) => {
    const role = staffRoleSchema.safeParse(req.params.role);
    if (!role.success) throw notFound('Staff roles are organizer and judge.');
    await removeStaffRole(
      db,
      req.user!.id,
      Number(req.params.eventId),
      idParam(req, 'userId', 'person'),
      role.data,
    );
    res.status(204).end();
  });

  return router;
}
