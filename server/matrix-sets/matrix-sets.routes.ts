import express, { type Router } from 'express';
import { matrixSetInputSchema } from '@shared/api/matrix-sets.ts';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import {
  createMatrixSet,
  deleteMatrixSet,
  getMatrixSet,
  listMatrixSets,
  replaceMatrixSet,
} from './matrix-sets.service.ts';

/** Matrix sets: list and read (members); create, replace and delete (maintainers). */
export function matrixSetsRouter(db: Db): Router {
  const router = express.Router();

  router.get('/teams/:teamId/matrix-sets', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listMatrixSets(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  router.post('/teams/:teamId/matrix-sets', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    const input = matrixSetInputSchema.parse(req.body ?? {});
    res.status(201).json(await createMatrixSet(db, user, teamId, input));
  });

  router.get('/matrix-sets/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await getMatrixSet(db, user, id));
  });

  router.put('/matrix-sets/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    const input = matrixSetInputSchema.parse(req.body ?? {});
    res.json(await replaceMatrixSet(db, user, id, input));
  });

  router.delete('/matrix-sets/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    await deleteMatrixSet(db, user, id);
    res.status(204).end();
  });

  return router;
}
