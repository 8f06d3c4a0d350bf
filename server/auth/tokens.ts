import { createHash, randomBytes, type KeyObject } from 'node:crypto';
import { SignJWT, jwtVerify } from 'jose';

const ACCESS_TTL_SECONDS = 15 * 60;
const ISSUER = 'ringcall';
const AUDIENCE = 'ringcall-api';

/**
 * `expiresAt`: the token's `exp`, in seconds since the epoch. `sessionVersion`: the account's
 * `session_version` when the token was made; a token older than the account's current one (a
 * password reset since) is refused.
 */
export type AccessClaims = { userId: number; expiresAt: number; sessionVersion: number };

/** Short-lived access token (HS256 with the server's secret). */
export async function signAccessToken(
  secret: Uint8Array,
  userId: number,
  sessionVersion = 0,
  now = new Date(),
) {
  const iat = Math.floor(now.getTime() / 1000);
  const exp = iat + ACCESS_TTL_SECONDS;
  const token = await new SignJWT({ sv: sessionVersion })
    .setProtectedHeader({ alg: 'HS256', typ: 'JWT' })
    .setSubject(String(userId))
    .setIssuer(ISSUER)
    .setAudience(AUDIENCE)
    .setIssuedAt(iat)
    .setExpirationTime(exp)
    .sign(secret);
  return { token, expiresAt: new Date(exp * 1000).toISOString() };
}

/** Verifies signature, algorithm (allow-list: HS256 only), issuer, audience and expiry. */
export async function verifyAccessToken(
  secret: Uint8Array | KeyObject,
  token: string,
): Promise<AccessClaims> {
  const { payload } = await jwtVerify(token, secret, {
    algorithms: ['HS256'],
    issuer: ISSUER,
    audience: AUDIENCE,
  });
  const userId = Number(payload.sub);
  if (!Number.isInteger(userId) || userId <= 0) throw new Error('Token has no valid subject.');
  if (payload.exp === undefined) throw new Error('Token has no expiry.');
  // Tokens made before session versions existed carry none: version 0.
  const sessionVersion = payload.sv === undefined ? 0 : Number(payload.sv);
  if (!Number.isInteger(sessionVersion)) throw new Error('Token has no valid session version.');
  return { userId, expiresAt: payload.exp, sessionVersion };
}

/** An opaque random token (refresh, e-mail links); only its hash is stored. */
export const randomToken = (): string => randomBytes(32).toString('base64url');

export const sha256Hex = (value: string): string => createHash('sha256').update(value).digest('hex');
