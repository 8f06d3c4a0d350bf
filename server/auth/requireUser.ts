import { createSecretKey } from 'node:crypto';
import type { RequestHandler } from 'express';
import type { Db } from '../db';
import { unauthorized } from '../http/httpError';
import { verifyAccessToken } from './tokens';
import { verifiedTokens } from './verifiedTokens';
import './types';

/** Requires a valid access token (`Authorization: Bearer …`) and loads the person it names. */
export function requireUser(db: Db, secret: Uint8Array): RequestHandler {
  // Imported once: turning raw bytes into a key on every request cost more than the check itself.
  const key = createSecretKey(secret);
  const verify = verifiedTokens((token) => verifyAccessToken(key, token));
  return async (req, _res, next) => {
    const header = req.get('authorization') ?? '';
    const match = /^Bearer (.+)$/i.exec(header);
    if (!match) return next(unauthorized());
    try {
      const { userId, sessionVersion } = await verify(match[1]!);
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
      next();
    } catch {
      next(unauthorized('Your sign-in has expired. Please sign in again.'));
    }
  };
}
