import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { createRevisionSchema } from '@shared/api/revisions.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';
import { listRevisionTrials } from '@server/trials/trials.service.ts';
import { kernelUpload } from './kernel-upload.ts';
import { getRevision, submitRevision } from './revisions.service.ts';

/** Revisions: add one to a candidate (JSON or `.ts` upload), read one, list its trials. */
export function revisionsRouter(db: Db, queue: TrialQueue | undefined): Router {
  const router = express.Router();

  router.post('/candidates/:id/revisions', kernelUpload, async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = createRevisionSchema.parse(req.body ?? {});
    res.status(201).json(await submitRevision(db, queue, user, id, input));
  });

  router.get('/revisions/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await getRevision(db, user, id));
  });

  router.get('/revisions/:id/trials', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await listRevisionTrials(db, user, id, paginationQuerySchema.parse(req.query)));
  });

  return router;
}
