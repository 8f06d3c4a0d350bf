import type { AcceptedInvitation, Me, SessionUser, SignUpInput, EventRole } from '../../src/contract/auth';
import type { Db } from '../db';
import type { Mailer } from '../mail/mailer';
import { conflict, HttpError, badRequest } from '../http/httpError';
import { dummyHashFor, hashPassword, passwordProblem, verifyPassword } from '../auth/passwords';
import { nowIso } from '../time';
import { audit } from './audit';
import { createEmailToken, findEmailToken, markEmailTokenUsed, type EmailTokenRow } from './emailTokens';
import { mailPasswordLink } from './passwordLinkMail';
import { endAllSessions } from './sessionsEnd';
import { reserveMail } from './limits/mailLimits';

export type UserRow = {
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

/** The address is proven (a link mailed to it was opened): mark it, and claim its entries. */
export async function markVerified(db: Db, user: UserRow): Promise<UserRow> {
  if (!user.email_verified_at)
    await db('users').where({ id: user.id }).update({ email_verified_at: nowIso() });
  await claimEntries(db, user);
  return (await db('users').where({ id: user.id }).first()) as UserRow;
}

const inviteInvalid = () =>
  new HttpError(
    410,
    'invite_invalid',
    'This invitation link is not valid any more. Ask the organizer for a new one.',
  );

/** An unused invitation for this address, or the reason it cannot be taken up. */
async function usableInvitation(db: Db, token: string, email: string): Promise<EmailTokenRow> {
  const invite = await findEmailToken(db, token, 'invite');
  if (!invite || !invite.event_id || !invite.role) throw inviteInvalid();
  if (email !== invite.email) {
    throw new HttpError(
      403,
      'invite_other_person',
      `This invitation was sent to ${invite.email}. Sign in with that address to accept it.`,
    );
  }
  return invite;
}

async function acceptedAnswer(db: Db, eventId: number, role: EventRole): Promise<AcceptedInvitation> {
  const event = await db('events').where({ id: eventId }).first('name');
  return { eventId, eventName: event.name as string, role };
}

/**
 * Accepts an invitation for the signed-in person: grants the role, and proves the address.
 * Taking it up again (sign-up with the link already did, and the screen asks once more) answers
 * the same, as long as the person still holds the role.
 */
export async function acceptInvitation(db: Db, token: string, userId: number): Promise<AcceptedInvitation> {
  const user = (await db('users').where({ id: userId }).first()) as UserRow;
  const taken = await findEmailToken(db, token, 'invite', { evenUsed: true });
  if (taken?.used_at && taken.event_id && taken.role && taken.email === user.email) {
    const held = await db('event_roles')
      .where({ event_id: taken.event_id, user_id: userId, role: taken.role })
      .first('id');
    if (held) return acceptedAnswer(db, taken.event_id, taken.role);
  }
  const invite = await usableInvitation(db, token, user.email);
  const eventId = invite.event_id!;
  const role = invite.role!;
  await grantRole(db, eventId, user.id, role);
  await markEmailTokenUsed(db, invite.id);
  await markVerified(db, user);
  await audit(db, { userId, eventId, action: 'invitation.accepted', details: { role } });
  return acceptedAnswer(db, eventId, role);
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

export type SignUpResult = { kind: 'created'; user: SessionUser } | { kind: 'pending'; email: string };

/**
 * Creates the account and mails a confirmation link (or, with an invitation link, takes it up).
 * An address whose account was never confirmed gives way to its mailbox's owner: with an
 * invitation to that address (which proves the mailbox) the account is taken over at once (new
 * password and name, its other sign-ins ended); without one, nothing changes until the person
 * opens a link mailed to the address and chooses the password there (`pending`).
 */
export async function signUp(
  db: Db,
  mailer: Mailer,
  input: SignUpInput,
  options: { bcryptCost: number; baseUrl: string },
): Promise<SignUpResult> {
  const problem = passwordProblem(input.password, input.email);
  if (problem) throw badRequest(problem, [{ path: 'password', message: problem }]);
  const invite = input.inviteToken ? await usableInvitation(db, input.inviteToken, input.email) : undefined;
  const existing = (await db('users').where({ email: input.email }).first()) as UserRow | undefined;
  if (existing?.email_verified_at)
    throw conflict('An account with this e-mail address already exists. Sign in instead.');
  if (existing && !invite) {
    await mailPasswordLink(db, mailer, input.email, options.baseUrl, {
      kind: 'sign-up',
      displayName: input.displayName,
    });
    return { kind: 'pending', email: input.email };
  }

  const passwordHash = await hashPassword(input.password, options.bcryptCost);
  let userId: number;
  if (existing) {
    await db('users')
      .where({ id: existing.id })
      .update({ password_hash: passwordHash, display_name: input.displayName });
    await endAllSessions(db, existing.id);
    await audit(db, { userId: existing.id, eventId: null, action: 'account.taken_over' });
    userId = existing.id;
  } else {
    const [created] = await db('users')
      .insert({
        email: input.email,
        display_name: input.displayName,
        password_hash: passwordHash,
        created_at: nowIso(),
      })
      .returning('id');
    userId = (created as { id: number }).id;
    await audit(db, { userId, eventId: null, action: 'account.created' });
  }

  if (input.inviteToken) await acceptInvitation(db, input.inviteToken, userId);
  const user = (await db('users').where({ id: userId }).first()) as UserRow;
  // The account stands even when the mail cannot leave (no mail server): the person can ask
  // for the link again later, and that request says why it fails.
  if (!input.inviteToken)
    await sendVerificationMail(db, mailer, user, options.baseUrl).catch((err: unknown) =>
      console.warn(
        `Confirmation mail to account ${user.id} not sent: ${err instanceof Error ? err.message : err}`,
      ),
    );
  return { kind: 'created', user: toSessionUser(user) };
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
