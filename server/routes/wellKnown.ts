import { Router } from 'express';
import type { AppContext } from '../context';

/**
 * `GET /.well-known/jwks.json`: the public half of the server's signing key, for anyone who wants
 * to check a printed or mailed signature. Public by design; cached for an hour.
 */
export function wellKnownRoutes(ctx: AppContext): Router {
  const router = Router();
  const body = { keys: [ctx.signingKeys.publicJwk] };
  router.get('/.well-known/jwks.json', (_req, res) => {
    res.setHeader('Cache-Control', 'public, max-age=3600');
    // Anyone may fetch it, from anywhere: it is what checks a printed card.
    res.setHeader('Access-Control-Allow-Origin', '*');
    res.setHeader('Cross-Origin-Resource-Policy', 'cross-origin');
    res.json(body);
  });
  return router;
}
