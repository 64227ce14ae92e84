import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { createTeamSchema, teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { createTeam, getTeam, listTeams } from './teams.service.ts';

/** Teams: list mine (an admin's: all), create (admin), read one. Mounted at `/api`. */
export function teamsRouter(db: Db): Router {
  const router = express.Router();

  router.get('/teams', async (req, res) => {
    const user = requireUser(req);
    res.json(await listTeams(db, user, paginationQuerySchema.parse(req.query)));
  });

  router.post('/teams', async (req, res) => {
    const user = requireUser(req);
    res.status(201).json(await createTeam(db, user, createTeamSchema.parse(req.body ?? {})));
  });

  router.get('/teams/:teamId', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await getTeam(db, user, teamId));
  });

  return router;
}
