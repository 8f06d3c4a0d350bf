import type { Db } from '../db';
import type { Mailer } from '../mail/mailer';
import { createEmailToken } from './emailTokens';

/**
 * Mails a single-use link (one hour) to set a new password. `reason` picks the words: a
 * forgotten password, or a sign-up under an address whose account was never confirmed (then the
 * name typed at sign-up travels in the link and replaces the account's when it is used).
 */
export async function mailPasswordLink(
  db: Db,
  mailer: Mailer,
  email: string,
  base: string,
  reason: { kind: 'forgot' } | { kind: 'sign-up'; displayName: string },
): Promise<void> {
  const token = await createEmailToken(db, {
    purpose: 'reset',
    email,
    ...(reason.kind === 'sign-up' ? { displayName: reason.displayName } : {}),
  });
  const link = `${base}/reset-password?token=${encodeURIComponent(token)}`;
  const why =
    reason.kind === 'forgot'
      ? 'Someone (we hope you) asked to set a new password for the Ringcall account of this address.'
      : 'Someone (we hope you) tried to create a Ringcall account with this address. An account with it already exists but was never confirmed, so only the person who reads this mail can take it over.';
  await mailer.send({
    to: email,
    subject:
      reason.kind === 'forgot' ? 'Set a new Ringcall password' : 'Finish creating your Ringcall account',
    text:
      `Hello,\n\n${why}\n\nOpen this link to choose your password (it works once, for one hour):\n\n${link}\n\n` +
      'Choosing it signs out every other phone signed in to this account. If you did not ask for this, ignore this mail: nothing changes.\n',
  });
}
