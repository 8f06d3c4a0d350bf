import type { InviteStaffInput, PendingInvitation, StaffList, StaffRole } from '../../../src/contract/events';
import type { Db } from '../../db';
import type { Mailer } from '../../mail/mailer';
import { conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { createEmailToken } from '../emailTokens';
import { loadEvent } from './events';
import { reserveMail } from '../limits/mailLimits';

const ROLE_WORDS: Record<StaffRole, string> = { organizer: 'an organizer', judge: 'a judge' };

async function pendingInvitations(db: Db, eventId: number): Promise<PendingInvitation[]> {
  const rows = await db('email_tokens')
    .where({ event_id: eventId, purpose: 'invite' })
    .whereNull('used_at')
    .where('expires_at', '>', nowIso())
    .orderBy('id')
    .select('id', 'email', 'role', 'created_at', 'expires_at');
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    sentAt: r.created_at,
    expiresAt: r.expires_at,
  }));
}

export async function listStaff(db: Db, eventId: number): Promise<StaffList> {
  const rows = await db('event_roles')
    .join('users', 'users.id', 'event_roles.user_id')
    .where('event_roles.event_id', eventId)
    .whereIn('event_roles.role', ['organizer', 'judge'])
    .orderBy([{ column: 'event_roles.role', order: 'desc' }, { column: 'users.display_name' }])
    .select(
      'users.id as user_id',
      'users.display_name',
      'users.email',
      'event_roles.role',
      'event_roles.created_at',
    );
  return {
    staff: rows.map((r) => ({
      userId: r.user_id,
      name: r.display_name,
      email: r.email,
      role: r.role,
      since: r.created_at,
    })),
    invitations: await pendingInvitations(db, eventId),
  };
}

/**
 * Invites a person by e-mail to be an organizer or judge. The role is granted only when they
 * accept the link (signed in with that address), even if they already have an account.
 * A new invitation for the same address and role replaces the one before it.
 */
export async function inviteStaff(
  db: Db,
  mailer: Mailer,
  input: InviteStaffInput & {
    eventId: number;
    invitedBy: { id: number; displayName: string };
    baseUrl: string;
  },
): Promise<PendingInvitation> {
  const event = await loadEvent(db, input.eventId);
  const holder = await db('event_roles')
    .join('users', 'users.id', 'event_roles.user_id')
    .where({
      'event_roles.event_id': input.eventId,
      'event_roles.role': input.role,
      'users.email': input.email,
    })
    .first('users.display_name');
  if (holder)
    throw conflict(
      `${holder.display_name} (${input.email}) is already ${ROLE_WORDS[input.role]} at this event.`,
    );

  await reserveMail(db, {
    kind: 'invite',
    sentBy: input.invitedBy.id,
    eventId: input.eventId,
    recipient: input.email,
  });
  await db('email_tokens')
    .where({ event_id: input.eventId, purpose: 'invite', email: input.email, role: input.role })
    .whereNull('used_at')
    .delete();
  const token = await createEmailToken(db, {
    purpose: 'invite',
    email: input.email,
    eventId: input.eventId,
    role: input.role,
    createdBy: input.invitedBy.id,
  });
  const link = `${input.baseUrl}/invite?token=${encodeURIComponent(token)}`;
  await mailer.send({
    to: input.email,
    subject: `You are invited to be ${ROLE_WORDS[input.role]} at ${event.name}`,
    text:
      `Hello,\n\n${input.invitedBy.displayName} invites you to be ${ROLE_WORDS[input.role]} at ${event.name}` +
      `${event.venue ? ` (${event.venue})` : ''}, ${event.starts_on === event.ends_on ? event.starts_on : `${event.starts_on} to ${event.ends_on}`}.\n\n` +
      `Open this link to accept. Sign in, or create a Ringcall account, with this e-mail address (${input.email}):\n\n${link}\n\n` +
      `The link works for 30 days. If you did not expect this invitation, ignore this mail.\n`,
  });
  await audit(db, {
    userId: input.invitedBy.id,
    eventId: input.eventId,
    action: 'staff.invited',
    details: { email: input.email, role: input.role },
  });
  const invitations = await pendingInvitations(db, input.eventId);
  return invitations.find((i) => i.email === input.email && i.role === input.role)!;
}

export async function cancelInvitation(
  db: Db,
  userId: number,
  eventId: number,
  invitationId: number,
): Promise<void> {
  const row = await db('email_tokens')
    .where({ id: invitationId, event_id: eventId, purpose: 'invite' })
    .whereNull('used_at')
    .first('id', 'email', 'role');
  if (!row) throw notFound('That invitation does not exist, or it was accepted already.');
  await db('email_tokens').where({ id: invitationId }).delete();
  await audit(db, {
    userId,
    eventId,
    action: 'staff.invitation_cancelled',
    details: { email: row.email, role: row.role },
  });
}

/** Takes a staff role away; the event always keeps at least one organizer. */
export async function removeStaffRole(
  db: Db,
  userId: number,
  eventId: number,
  staffUserId: number,
  role: StaffRole,
): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('event_roles').where({ event_id: eventId, user_id: staffUserId, role }).first('id');
    if (!row) throw notFound(`That person is not ${ROLE_WORDS[role]} at this event.`);
    if (role === 'organizer') {
      const organizers = await trx('event_roles')
        .where({ event_id: eventId, role: 'organizer' })
        .count<{ n: number | string }[]>({ n: '*' })
        .first();
      if (Number(organizers?.n ?? 0) <= 1) {
        throw conflict(
          "This is the event's only organizer. Invite another organizer first, then remove this one.",
        );
      }
    }
    await trx('event_roles').where({ id: row.id }).delete();
    await audit(trx, { userId, eventId, action: 'staff.removed', details: { userId: staffUserId, role } });
  });
}
