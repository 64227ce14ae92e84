import express, { type Router } from 'express';
import { memberParamsSchema, updateMemberSchema } from '@shared/api/members.ts';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { changeMemberRole, listMembers, removeMember } from './members.service.ts';

/** A team's members: list (members), change a role and remove (maintainers, admins). */
export function membersRouter(db: Db): Router {
  const router = express.Router();

  router.get('/teams/:teamId/members', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listMembers(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  router.patch('/teams/:teamId/members/:userId', async (req, res) => {
    const user = requireUser(req);
    const { teamId, userId } = memberParamsSchema.parse(req.params);
    const input = updateMemberSchema.parse(req.body ?? {});
    res.json(await changeMemberRole(db, user, teamId, userId, input));
  });

  router.delete('/teams/:teamId/members/:userId', async (req, res) => {
    const user = requireUser(req);
    const { teamId, userId } = memberParamsSchema.parse(req.params);
    await removeMember(db, user, teamId, userId);
    res.status(204).end();
  });

  return router;
}
