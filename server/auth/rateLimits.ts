import type { Request } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { HttpError } from '../http/httpError';

const WINDOW_MS = 15 * 60 * 1000;

function tooMany(message: string) {
  return (_req: Request, _res: unknown, next: (err: unknown) => void) =>
    next(new HttpError(429, 'too_many_attempts', message));
}

/**
 * New accounts per address: a whole field signs up on one Wi-Fi address at the start of the day
 * (a club's archers and volunteers, a few hundred), so the limit only stops a script.
 */
export function signUpLimit() {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit: 500,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: tooMany('Too many new accounts from this network. Wait 15 minutes and try again.'),
  });
}

/**
 * "Forgot password" mails a link: a few per address asked for (whether or not it has an account,
 * so the limit reveals nothing), and a generous number per network.
 */
export function forgotPasswordLimits() {
  const common = { windowMs: WINDOW_MS, standardHeaders: 'draft-8', legacyHeaders: false } as const;
  return [
    rateLimit({
      ...common,
      limit: 200,
      keyGenerator: (req) => `forgot-ip:${ipKeyGenerator(req.ip ?? '')}`,
      handler: tooMany('Too many password links asked for from this network. Wait 15 minutes and try again.'),
    }),
    rateLimit({
      ...common,
      limit: 3,
      keyGenerator: (req) =>
        // Runs after validation: the address is already trimmed and lower-case.
        `forgot:${(req.body as { email: string }).email}`,
      handler: tooMany(
        'A link for this address was asked for three times already. Look for it in your mail, or wait 15 minutes.',
      ),
    }),
  ];
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
