import type { Db } from '../db';
import type { Mailer } from '../mail/mailer';
import { HttpError, badRequest } from '../http/httpError';
import { hashPassword, passwordProblem } from '../auth/passwords';
import { audit } from './audit';
import { findEmailToken, markAllUsed, useEmailTokenOnce } from './emailTokens';
import { markVerified, type UserRow } from './accounts';
import { mailPasswordLink } from './passwordLinkMail';
import { endAllSessions } from './sessionsEnd';

/** "Forgot password": mails the link when the address has an account, and says nothing either way. */
export async function forgotPassword(db: Db, mailer: Mailer, email: string, base: string): Promise<void> {
  const account = await db('users').where({ email }).first('id');
  if (account) await mailPasswordLink(db, mailer, email, base, { kind: 'forgot' });
}

/**
 * Sets the new password from a link: the link and every other password link of the address stop
 * working, every other sign-in of the account ends, and the address counts as confirmed (the
 * link reached its mailbox). Returns the account's id, to sign this phone in.
 */
export async function resetPassword(
  db: Db,
  input: { token: string; password: string },
  bcryptCost: number,
): Promise<{ userId: number; email: string }> {
  const invalid = () =>
    new HttpError(
      410,
      'link_invalid',
      'This password link is not valid any more (it works once, for one hour). Ask for a new one.',
    );
  const link = await findEmailToken(db, input.token, 'reset');
  const account = link && ((await db('users').where({ email: link.email }).first()) as UserRow | undefined);
  if (!link || !account) throw invalid();
  const problem = passwordProblem(input.password, account.email);
  if (problem) throw badRequest(problem, [{ path: 'password', message: problem }]);
  const passwordHash = await hashPassword(input.password, bcryptCost);
  // Taken only now (a refused password leaves the link usable), and only once, however many
  // requests carry it at the same time.
  if (!(await useEmailTokenOnce(db, link.id))) throw invalid();
  await db('users')
    .where({ id: account.id })
    .update({
      password_hash: passwordHash,
      ...(link.display_name ? { display_name: link.display_name } : {}),
    });
  await markAllUsed(db, account.email, 'reset');
  await endAllSessions(db, account.id);
  await markVerified(db, account);
  await audit(db, { userId: account.id, eventId: null, action: 'account.password_reset' });
  return { userId: account.id, email: account.email };
}
