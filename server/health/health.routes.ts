import { Router } from 'express';
import type pg from 'pg';
import { checkHealth } from './health.service.ts';

export function healthRouter(pool: pg.Pool): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const health = await checkHealth(pool);
    res.status(health.ok ? 200 : 503).json(health);
  });
  return router;
}
