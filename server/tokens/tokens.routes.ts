import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { createApiTokenSchema } from '@shared/api/tokens.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { createToken, listMyTokens, revokeToken } from './tokens.service.ts';

/** The caller's own API tokens: list, create (secret shown once), revoke. */
export function tokensRouter(db: Db): Router {
  const router = express.Router();

  router.get('/', async (req, res) => {
    const user = requireUser(req);
    res.json(await listMyTokens(db, user, paginationQuerySchema.parse(req.query)));
  });

  router.post('/', async (req, res) => {
    const user = requireUser(req);
    res.status(201).json(await createToken(db, user, createApiTokenSchema.parse(req.body ?? {})));
  });

  router.delete('/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await revokeToken(db, user, id));
  });

  return router;
}
