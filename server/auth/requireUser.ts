import { createSecretKey } from 'node:crypto';
import type { RequestHandler } from 'express';
import type { Db } from '../db';
import { unauthorized } from '../http/httpError';
import { verifyAccessToken } from './tokens';
import { verifiedTokens } from './verifiedTokens';
import { signInsEndedCount } from './signInsEnded';
import type { AuthUser } from './types';

/** Far more than the phones of a large tournament, each holding one token at a time. */
const REMEMBERED = 10_000;

/** The person an `Authorization` header names; refuses (a 401 HttpError) anything else. */
export type PersonOfHeader = (authorization: string | undefined) => Promise<AuthUser>;

/**
 * Reads the person a valid access token (`Authorization: Bearer …`) names.
 *
 * With `remember` (the sync routes, which a phone calls every few seconds and which use only the
 * person's id) the person is kept with the token until it expires, instead of being read on
 * every request; ending an account's sign-ins (signInsEnded.ts) makes every remembered person be
 * read again, so a reset password still refuses the token at once.
 */
export function personOfHeader(
  db: Db,
  secret: Uint8Array,
  options: { remember?: boolean } = {},
): PersonOfHeader {
  // Imported once: turning raw bytes into a key on every request cost more than the check itself.
  const key = createSecretKey(secret);
  const verify = verifiedTokens((token) => verifyAccessToken(key, token));
  const remembered = new Map<string, { person: AuthUser; expiresAt: number; ended: number }>();
  return async (header) => {
    const match = /^Bearer (.+)$/i.exec(header ?? '');
    if (!match) throw unauthorized();
    const token = match[1]!;
    let claims;
    try {
      claims = await verify(token);
    } catch {
      throw unauthorized('Your sign-in has expired. Please sign in again.');
    }
    const { userId, sessionVersion, expiresAt } = claims;
    const known = remembered.get(token);
    if (known && known.ended === signInsEndedCount() && Date.now() / 1000 < known.expiresAt)
      return known.person;
    remembered.delete(token);
    // Read before the look-up: an end of sign-ins during it makes this entry stale.
    const ended = signInsEndedCount();
    const user = await db('users').where({ id: userId }).first();
    if (!user) throw unauthorized('Your account was not found. Please sign in again.');
    // The password was reset (or an unconfirmed account taken over) since this sign-in.
    if (sessionVersion !== user.session_version)
      throw unauthorized('Your sign-in has ended. Please sign in again.');
    const person: AuthUser = {
      id: user.id,
      email: user.email,
      displayName: user.display_name,
      emailVerified: !!user.email_verified_at,
    };
    if (options.remember) {
      remembered.set(token, { person, expiresAt, ended });
      if (remembered.size > REMEMBERED) remembered.delete(remembered.keys().next().value!);
    }
    return person;
  };
}

/** Requires a valid access token and sets `req.user` to the person it names (personOfHeader). */
export function requireUser(db: Db, secret: Uint8Array): RequestHandler {
  const personOf = personOfHeader(db, secret);
  return async (req, _res, next) => {
    try {
      req.user = await personOf(req.get('authorization'));
      next();
    } catch (error) {
      next(error);
    }
  };
}
