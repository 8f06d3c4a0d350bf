import { existsSync } from 'node:fs';
import { join, sep } from 'node:path';
import express, { type Router } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { routePreloads } from './routePreloads';

/**
 * Serves the built PWA and falls back to index.html for client routes. Paths under /api and
 * /.well-known never reach the fallback: they answer JSON from their own handlers.
 * Text files go out as the brotli or gzip copy the build wrote beside them (scripts/precompress.ts),
 * whichever the browser accepts, with `Vary: Accept-Encoding` so a cache keeps them apart.
 */
export function clientFiles(clientDir: string): Router | undefined {
  const indexFile = join(clientDir, 'index.html');
  if (!existsSync(indexFile)) return undefined;
  const assetsDir = join(clientDir, 'assets') + sep;
  const files = expressStaticGzip(clientDir, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      setHeaders(res, path) {
        // Hashed assets never change; the shell, manifest and service worker must always be revalidated.
        if (path.startsWith(assetsDir)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        else res.setHeader('Cache-Control', 'no-cache');
      },
    },
  }) as express.RequestHandler;
  const preloadsFor = routePreloads(clientDir);
  const router = express.Router();
  router.use(files);
  router.get(/^(?!\/api(\/|$)|\/\.well-known(\/|$)).*/, (req, res, next) => {
    if (!req.accepts('html')) return next();
    const preloads = preloadsFor(req.path);
    if (preloads) res.setHeader('Link', preloads);
    // Any client route is the shell, sent like the file itself (compressed, no-cache).
    req.url = '/index.html';
    files(req, res, next);
  });
  return router;
}
