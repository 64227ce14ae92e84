import express, { type Router } from 'express';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { listAudit } from './audit.service.ts';

/** A team's audit log. Mounted at `/api`. */
export function auditRouter(db: Db): Router {
  const router = express.Router();

  router.get('/teams/:teamId/audit', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listAudit(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  return router;
}
