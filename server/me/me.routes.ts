import express, { type Router } from 'express';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { describeMe } from './me.service.ts';

/** `GET /api/me`: the signed-in person and their teams; 401 for anyone else. */
export function meRouter(db: Db): Router {
  const router = express.Router();
  router.get('/', async (req, res) => {
    res.json(await describeMe(db, requireUser(req)));
  });
  return router;
}
