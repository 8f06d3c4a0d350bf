import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, Response } from 'express';

const NAME = 'rc_device';
const PATH = '/api/auth';
const ONE_YEAR_MS = 365 * 24 * 3600 * 1000;

/**
 * A "known device" cookie: set when someone signs in to an account, it lets that phone's later
 * sign-ins to the same account skip the throttles a stranger's guessing raises (per address, and
 * per account and address). A person who signed in on this phone before is then never held up by
 * someone hammering their account from the same field Wi-Fi. The cookie names a random id and the
 * account's address, bound together with the server's secret; only the phone holds it (httpOnly).
 */
export function deviceCookies(secret: Uint8Array) {
  const mac = (email: string, id: string) =>
    createHmac('sha256', secret).update(`device:${email}:${id}`).digest('base64url');

  return {
    /** Marks this phone as one the account's owner signed in from. */
    remember(req: Request, res: Response, email: string): void {
      const id = randomBytes(16).toString('base64url');
      res.cookie(NAME, `${id}.${mac(email, id)}`, {
        httpOnly: true,
        sameSite: 'strict',
        secure: req.secure,
        path: PATH,
        maxAge: ONE_YEAR_MS,
      });
    },
    /** The device id when the request carries a valid cookie for this address, else undefined. */
    knownDevice(req: Request, email: string): string | undefined {
      const value = (req.cookies as Record<string, unknown> | undefined)?.[NAME];
      if (typeof value !== 'string') return undefined;
      const [id, given] = value.split('.');
      if (!id || !given) return undefined;
      const expected = Buffer.from(mac(email, id));
      const actual = Buffer.from(given);
      return actual.length === expected.length && timingSafeEqual(actual, expected) ? id : undefined;
    },
  };
}
