import express, { type Router } from 'express';
import {
  acceptInvitationSchema,
  createInvitationSchema,
  invitationParamsSchema,
} from '@shared/api/invitations.ts';
import { paginationQuerySchema } from '@shared/api/pagination.ts';
import { teamParamsSchema } from '@shared/api/teams.ts';
import { requireUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { acceptInvitation } from './invitation-accept.service.ts';
import { createInvitation, listInvitations, revokeInvitation } from './invitations.service.ts';

/** Invitations by e-mail: send, list pending, revoke (maintainers, admins); accept (anyone signed in). */
export function invitationsRouter(db: Db, env: Env): Router {
  const router = express.Router();

  router.post('/teams/:teamId/invitations', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    const input = createInvitationSchema.parse(req.body ?? {});
    res.status(201).json(await createInvitation(db, env, user, teamId, input));
  });

  router.get('/teams/:teamId/invitations', async (req, res) => {
    const user = requireUser(req);
    const { teamId } = teamParamsSchema.parse(req.params);
    res.json(await listInvitations(db, user, teamId, paginationQuerySchema.parse(req.query)));
  });

  router.delete('/teams/:teamId/invitations/:id', async (req, res) => {
    const user = requireUser(req);
    const { teamId, id } = invitationParamsSchema.parse(req.params);
    res.json(await revokeInvitation(db, user, teamId, id));
  });

  router.post('/invitations/accept', async (req, res) => {
    const user = requireUser(req);
    res.json(await acceptInvitation(db, user, acceptInvitationSchema.parse(req.body ?? {})));
  });

  return router;
}
