import express, { type Router } from 'express';
import { createCandidateSchema, listCandidatesQuerySchema } from '@shared/api/candidates.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';
import { kernelUpload } from '@server/revisions/kernel-upload.ts';
import {
  createCandidate,
  getCandidate,
  listCandidates,
  withdrawCandidate,
} from './candidates.service.ts';

/** Candidates: list a routine's, submit one (JSON or `.ts` upload), read one, withdraw one. */
export function candidatesRouter(db: Db, queue: TrialQueue | undefined): Router {
  const router = express.Router();

  router.get('/routines/:id/candidates', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await listCandidates(db, user, id, listCandidatesQuerySchema.parse(req.query)));
  });

  router.post('/routines/:id/candidates', kernelUpload, async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = createCandidateSchema.parse(req.body ?? {});
    res.status(201).json(await createCandidate(db, queue, user, id, input));
  });

  router.get('/candidates/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await getCandidate(db, user, id));
  });

  router.post('/candidates/:id/withdraw', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await withdrawCandidate(db, user, id));
  });

  return router;
}
