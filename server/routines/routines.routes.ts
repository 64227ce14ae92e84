import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { createRoutineSchema, updateRoutineSchema } from '@shared/api/routines.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { createRoutine, getRoutine, listRoutines, updateRoutine } from './routines.service.ts';

/** Routines: list and read (members); create and change (maintainers). */
export function routinesRouter(db: Db): Router {
  const router = express.Router();

  router.get('/teams/:teamId/routines', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listRoutines(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  router.post('/teams/:teamId/routines', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    const input = createRoutineSchema.parse(req.body ?? {});
    res.status(201).json(await createRoutine(db, user, teamId, input));
  });

  router.get('/routines/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await getRoutine(db, user, id));
  });

  router.patch('/routines/:id', async (req, res) => {
    const user = requireUser(req);
    const { id } = idParamsSchema.parse(req.params);
    res.json(await updateRoutine(db, user, id, updateRoutineSchema.parse(req.body ?? {})));
  });

  return router;
}
