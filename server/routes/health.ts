import { Router } from 'express';
import type { Health } from '../../src/contract/health';

export function healthRoutes(version: string): Router {
  const router = Router();
  router.get('/health', (_req, res) => {
    const body: Health = { ok: true, version };
    res.json(body);
  });
  return router;
}
