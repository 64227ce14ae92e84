import express, { type Router } from 'express';
import { createCommentSchema } from '@shared/api/comments.ts';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { addComment, listComments } from './comments.service.ts';

/** Comments on a candidate: general, on a revision, or on one line of a revision. */
export function commentsRouter(db: Db): Router {
  const router = express.Router();

  router.get('/candidates/:id/comments', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await listComments(db, user, id, paginationQuerySchema.parse(req.query)));
  });

  router.post('/candidates/:id/comments', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = createCommentSchema.parse(req.body ?? {});
    res.status(201).json(await addComment(db, user, id, input));
  });

  return router;
}
