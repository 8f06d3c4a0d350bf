import { Router } from 'express';
import type { AppContext } from '../context';
import { verifyLimit } from '../auth/rateLimits';
import { badRequest } from '../http/httpError';
import { verifySignature } from '../services/signing/verify';

/** Public: anyone holding a printed or mailed card may check its signature. */
export function verifyRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/verify', verifyLimit(), async (req, res) => {
    const sig = req.query.sig;
    if (typeof sig !== 'string' || sig.trim() === '')
      throw badRequest('Give the signature to check as ?sig=… (the link in the QR code on the card has it).');
    res.setHeader('Cache-Control', 'no-store');
    res.json(await verifySignature(ctx.db, ctx.signingKeys, sig.trim()));
  });

  return router;
}
