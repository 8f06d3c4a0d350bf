import type { Request } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { HttpError } from '../http/httpError';

const WINDOW_MS = 15 * 60 * 1000;

function tooMany(message: string) {
  return (_req: Request, _res: unknown, next: (err: unknown) => void) =>
    next(new HttpError(429, 'too_many_attempts', message));
}

/**
 * Failed sign-ins are limited per account and per address. Only failures count, and the window
 * is 15 minutes, so a real person who mistypes is never locked out for long. The per-address
 * limit is generous: a whole club can share one field Wi-Fi address.
 */
export function signInLimits() {
  const perAccount = rateLimit({
    windowMs: WINDOW_MS,
    limit: 10,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) =>
      `account:${String((req.body as { email?: unknown } | undefined)?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: tooMany(
      'Too many wrong passwords for this account. Wait 15 minutes and try again, or ask the organizer for help.',
    ),
  });
  const perAddress = rateLimit({
    windowMs: WINDOW_MS,
    limit: 100,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: tooMany('Too many failed sign-ins from this network. Wait 15 minutes and try again.'),
  });
  return [perAddress, perAccount];
}

/** Sign-up and e-mail links are cheap to abuse for sending mail; keep them modest per address. */
export function signUpLimit() {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit: 30,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: tooMany('Too many new accounts from this network. Wait 15 minutes and try again.'),
  });
}

/**
 * Checking a signature is public (a QR code on a printed card) and reads the card from the
 * database; a generous per-address limit keeps anyone from hammering it.
 */
export function verifyLimit() {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit: 600,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `verify:${ipKeyGenerator(req.ip ?? '')}`,
    handler: tooMany('Too many signature checks from this network. Wait 15 minutes and try again.'),
  });
}
