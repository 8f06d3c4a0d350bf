import { createSecretKey } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import type { Db } from '../db';
import { unauthorized } from '../http/httpError';
import { verifyAccessToken } from './tokens';
import { verifiedTokens } from './verifiedTokens';
import { signInsEndedCount } from './signInsEnded';
import './types';

type Person = NonNullable<Request['user']>;

/** Far more than the phones of a large tournament, each holding one token at a time. */
const REMEMBERED = 10_000;

/**
 * Requires a valid access token (`Authorization: Bearer …`) and loads the person it names.
 *
 * With `remember` (the sync routes, which a phone calls every few seconds and which use only the
 * person's id) the person is kept with the token until it expires, instead of being read on
 * every request; ending an account's sign-ins (signInsEnded.ts) makes every remembered person be
 * read again, so a reset password still refuses the token at once.
 */
export function requireUser(
  db: Db,
  secret: Uint8Array,
  options: { remember?: boolean } = {},
): RequestHandler {
  // Imported once: turning raw bytes into a key on every request cost more than the check itself.
  const key = createSecretKey(secret);
  const verify = verifiedTokens((token) => verifyAccessToken(key, token));
  const remembered = new Map<string, { person: Person; expiresAt: number; ended: number }>();
  return async (req, _res, next) => {
    const header = req.get('authorization') ?? '';
    const match = /^Bearer (.+)$/i.exec(header);
    if (!match) return next(unauthorized());
    const token = match[1]!;
    try {
      const { userId, sessionVersion, expiresAt } = await verify(token);
      const known = remembered.get(token);
      if (known && known.ended === signInsEndedCount() && Date.now() / 1000 < known.expiresAt) {
        req.user = known.person;
        return next();
      }
      remembered.delete(token);
      // Read before the look-up: an end of sign-ins during it makes this entry stale.
      const ended = signInsEndedCount();
      const user = await db('users').where({ id: userId }).first();
      if (!user) return next(unauthorized('Your account was not found. Please sign in again.'));
      // The password was reset (or an unconfirmed account taken over) since this sign-in.
      if (sessionVersion !== user.session_version)
        return next(unauthorized('Your sign-in has ended. Please sign in again.'));
      req.user = {
        id: user.id,
        email: user.email,
        displayName: user.display_name,
        emailVerified: !!user.email_verified_at,
      };
      if (options.remember) {
        remembered.set(token, { person: req.user, expiresAt, ended });
        if (remembered.size > REMEMBERED) remembered.delete(remembered.keys().next().value!);
      }
      next();
    } catch {
      next(unauthorized('Your sign-in has expired. Please sign in again.'));
    }
  };
}
