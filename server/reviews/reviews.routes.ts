import express, { type Router } from 'express';
import { idParamsSchema } from '@shared/api/params.ts';
import { createReviewSchema } from '@shared/api/reviews.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { submitReview } from './reviews.service.ts';

/** Verdicts: sign off or send back a candidate's latest revision. */
export function reviewsRouter(db: Db, env: Env): Router {
  const router = express.Router();

  router.post('/candidates/:id/reviews', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = createReviewSchema.parse(req.body ?? {});
    res.status(201).json(await submitReview(db, env, user, id, input));
  });

  return router;
}
