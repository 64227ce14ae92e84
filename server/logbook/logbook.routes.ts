import express, { type Router } from 'express';
import { idParamsSchema } from '@shared/api/params.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { getLogbook } from './logbook.service.ts';

/** A routine's logbook: promotions, tenures, drift checks. */
export function logbookRouter(db: Db): Router {
  const router = express.Router();

  router.get('/routines/:id/logbook', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await getLogbook(db, user, id));
  });

  return router;
}
