import { existsSync } from 'node:fs';
import { join } from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the built PWA and falls back to index.html for client routes. Paths under /api and
 * /.well-known never reach the fallback: they answer JSON from their own handlers.
 */
export function clientFiles(clientDir: string): Router | undefined {
  const indexFile = join(clientDir, 'index.html');
  if (!existsSync(indexFile)) return undefined;
  const router = express.Router();
  router.use(
    express.static(clientDir, {
      index: false,
      setHeaders(res, path) {
        // Hashed assets never change; the shell, manifest and service worker must always be revalidated.
        if (path.includes(`${join(clientDir, 'assets')}`))
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        else res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  router.get(/^(?!\/api(\/|$)|\/\.well-known(\/|$)).*/, (req, res, next) => {
    if (!req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  return router;
}
