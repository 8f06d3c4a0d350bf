import type { RequestHandler } from 'express';

/**
 * Every API answer is `Cache-Control: no-store` unless its route says otherwise: most carry
 * personal data (who is signed in, entries, mail, pulled scores, cards), and a shared phone's
 * browser or a proxy on the field network must never keep them. A route whose answer is public
 * and cacheable sets its own header after this one.
 */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
