import type { EventRole, Me, SessionUser, SignUpInput } from '../../src/contract/auth';
import type { Db } from '../db';
import type { Mailer } from '../mail/mailer';
import { conflict, HttpError, badRequest } from '../http/httpError';
import { dummyHashFor, hashPassword, passwordProblem, verifyPassword } from '../auth/passwords';
import { nowIso } from '../time';
import { audit } from './audit';
import { createEmailToken, findEmailToken, markEmailTokenUsed } from './emailTokens';
import { reserveMail } from './limits/mailLimits';

type UserRow = {
  id: number;
  email: string;
  display_name: string;
  password_hash: string | null;
  email_verified_at: string | null;
};

export const toSessionUser = (u: UserRow): SessionUser => ({
  id: u.id,
  email: u.email,
  displayName: u.display_name,
  emailVerified: !!u.email_verified_at,
});

/** Gives the person a role in an event once (repeated grants are no-ops). */
export async function grantRole(db: Db, eventId: number, userId: number, role: EventRole): Promise<void> {
  const existing = await db('event_roles').where({ event_id: eventId, user_id: userId, role }).first('id');
  if (!existing)
    await db('event_roles').insert({ event_id: eventId, user_id: userId, role, created_at: nowIso() });
}

/**
 * Once an address is proven (verification link or invitation), entries on entry lists with that
 * address become this person's, and they become an archer in those events.
 */
async function claimEntries(db: Db, user: UserRow): Promise<void> {
  const entries = await db('entries')
    .whereNull('user_id')
    .where({ email: user.email })
    .select('id', 'event_id');
  for (const entry of entries) {
    await db('entries').where({ id: entry.id }).update({ user_id: user.id });
    await grantRole(db, entry.event_id, user.id, 'archer');
  }
}

async function markVerified(db: Db, user: UserRow): Promise<UserRow> {
  if (!user.email_verified_at)
    await db('users').where({ id: user.id }).update({ email_verified_at: nowIso() });
  await claimEntries(db, user);
  return (await db('users').where({ id: user.id }).first()) as UserRow;
}

/** Accepts an invitation for the signed-in person: grants the role, and proves the address. */
export async function acceptInvitation(
  db: Db,
  token: string,
  userId: number,
): Promise<{ eventId: number; role: EventRole }> {
  const invite = await findEmailToken(db, token, 'invite');
  if (!invite || !invite.event_id || !invite.role) {
    throw new HttpError(
      410,
      'invite_invalid',
      'This invitation link is not valid any more. Ask the organizer for a new one.',
    );
  }
  const user = (await db('users').where({ id: userId }).first()) as UserRow;
  if (user.email !== invite.email) {
    throw new HttpError(
      403,
      'invite_other_person',
      `This invitation was sent to ${invite.email}. Sign in with that address to accept it.`,
    );
  }
  await grantRole(db, invite.event_id, user.id, invite.role);
  await markEmailTokenUsed(db, invite.id);
  await markVerified(db, user);
  await audit(db, {
    userId,
    eventId: invite.event_id,
    action: 'invitation.accepted',
    details: { role: invite.role },
  });
  return { eventId: invite.event_id, role: invite.role };
}

export async function sendVerificationMail(
  db: Db,
  mailer: Mailer,
  user: UserRow,
  base: string,
): Promise<void> {
  await reserveMail(db, { kind: 'verify', sentBy: user.id, eventId: null, recipient: user.email });
  const token = await createEmailToken(db, { purpose: 'verify', email: user.email });
  await mailer.send({
    to: user.email,
    subject: 'Confirm your e-mail address for Ringcall',
    text:
      `Hello ${user.display_name},\n\nPlease confirm this address so Ringcall can link you to your entries and send you your signed scorecards:\n\n` +
      `${base}/verify-email?token=${encodeURIComponent(token)}\n\nIf you did not create a Ringcall account, ignore this mail.\n`,
  });
}

export async function signUp(
  db: Db,
  mailer: Mailer,
  input: SignUpInput,
  options: { bcryptCost: number; baseUrl: string },
): Promise<SessionUser> {
  const problem = passwordProblem(input.password);
  if (problem) throw badRequest(problem, [{ path: 'password', message: problem }]);
  const existing = await db('users').where({ email: input.email }).first();
  if (existing) throw conflict('An account with this e-mail address already exists. Sign in instead.');

  const passwordHash = await hashPassword(input.password, options.bcryptCost);
  const [created] = await db('users')
    .insert({
      email: input.email,
      display_name: input.displayName,
      password_hash: passwordHash,
      created_at: nowIso(),
    })
    .returning('id');
  let user = (await db('users')
    .where({ id: (created as { id: number }).id })
    .first()) as UserRow;
  await audit(db, { userId: user.id, eventId: null, action: 'account.created' });

  if (input.inviteToken) {
    await acceptInvitation(db, input.inviteToken, user.id);
    user = (await db('users').where({ id: user.id }).first()) as UserRow;
  } else {
    // The account stands even when the mail cannot leave (no mail server): the person can ask
    // for the link again later, and that request says why it fails.
    await sendVerificationMail(db, mailer, user, options.baseUrl).catch((err: unknown) =>
      console.warn(
        `Confirmation mail to account ${user.id} not sent: ${err instanceof Error ? err.message : err}`,
      ),
    );
  }
  return toSessionUser(user);
}

export async function verifyEmail(db: Db, token: string): Promise<SessionUser> {
  const row = await findEmailToken(db, token, 'verify');
  if (!row)
    throw new HttpError(
      410,
      'link_invalid',
      'This confirmation link is not valid any more. Sign in and ask for a new one.',
    );
  const user = (await db('users').where({ email: row.email }).first()) as UserRow | undefined;
  if (!user) throw new HttpError(410, 'link_invalid', 'This confirmation link belongs to no account.');
  await markEmailTokenUsed(db, row.id);
  return toSessionUser(await markVerified(db, user));
}

/** Checks e-mail and password; the same message and similar timing whether or not the account exists. */
export async function checkCredentials(
  db: Db,
  email: string,
  password: string,
  bcryptCost: number,
): Promise<SessionUser | undefined> {
  const user = (await db('users').where({ email }).first()) as UserRow | undefined;
  if (!user || !user.password_hash) {
    await verifyPassword(password, await dummyHashFor(bcryptCost));
    return undefined;
  }
  return (await verifyPassword(password, user.password_hash)) ? toSessionUser(user) : undefined;
}

export async function loadMe(db: Db, user: SessionUser): Promise<Me> {
  const rows = await db('event_roles')
    .join('events', 'events.id', 'event_roles.event_id')
    .where('event_roles.user_id', user.id)
    .orderBy('events.starts_on', 'desc')
    .select('events.id as eventId', 'events.name as eventName', 'event_roles.role as role');
  return { user, roles: rows as Me['roles'] };
}
