import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { promoteSchema, reinstateSchema } from '@shared/api/promotions.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { listCleared, promoteCandidate } from './promotions.service.ts';
import { reinstateIncumbent } from './reinstate.service.ts';

/** Maintainers: the cleared candidates, promote one, reinstate an earlier incumbent. */
export function promotionsRouter(db: Db, env: Env): Router {
  const router = express.Router();

  router.get('/routines/:id/cleared', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await listCleared(db, user, id, paginationQuerySchema.parse(req.query)));
  });

  router.post('/candidates/:id/promote', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = promoteSchema.parse(req.body ?? {});
    res.status(201).json(await promoteCandidate(db, env, user, id, input));
  });

  router.post('/routines/:id/reinstate', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = reinstateSchema.parse(req.body ?? {});
    res.status(201).json(await reinstateIncumbent(db, env, user, id, input));
  });

  return router;
}
