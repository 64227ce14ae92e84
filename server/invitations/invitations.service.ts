import { randomBytes } from 'node:crypto';
import {
  invitationLifetimeDays,
  type CreateInvitation,
  type Invitation,
  type InvitationPage,
} from '@shared/api/invitations.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import { hashSecret } from '@server/auth/api-token-secret.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { invitationEmail } from '@server/mail/messages/invitation-email.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import { requireMemberManager } from '@server/members/members.policy.ts';
import { findTeam } from '@server/teams/teams.repo.ts';
import { toInvitation } from './invitation-mapping.ts';
import {
  findTeamInvitation,
  insertInvitation,
  listPendingInvitations,
  markRevoked,
} from './invitations.repo.ts';

const dayMs = 24 * 60 * 60 * 1000;

/**
 * Invites an e-mail address into the team with a role (maintainers, admins). Only the hash of
 * the link's secret is stored; the secret travels in the e-mail alone, queued in the same
 * transaction as the invitation so that both exist or neither does.
 */
export async function createInvitation(
  db: Db,
  env: Env,
  user: CurrentUser,
  teamId: number,
  input: CreateInvitation,
): Promise<Invitation> {
  await requireMemberManager(db, user, teamId);
  const team = await findTeam(db, teamId);
  if (!team) throw new AppError('not-found', 'No such team.');
  const secret = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + invitationLifetimeDays * dayMs);
  const id = await db.transaction(async (tx) => {
    const row = await insertInvitation(tx, {
      teamId,
      email: input.email,
      role: input.role,
      tokenHash: hashSecret(secret),
      invitedBy: user.id,
      expiresAt,
    });
    const message = invitationEmail(env, {
      teamName: team.name,
      role: input.role,
      inviterName: user.login,
      token: secret,
      expiresAt,
    });
    await enqueueEmail(tx, { kind: 'invitation', to: input.email, ...message });
    await recordAudit(tx, {
      actorId: user.id,
      teamId,
      action: 'invitation.created',
      entity: 'invitation',
      entityId: row.id,
      details: { email: input.email, role: input.role, expiresAt: expiresAt.toISOString() },
    });
    return row.id;
  });
  const created = await findTeamInvitation(db, teamId, id);
  return toInvitation(created!);
}

/** The team's pending invitations, newest first (maintainers, admins). */
export async function listInvitations(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<InvitationPage> {
  await requireMemberManager(db, user, teamId);
  const { rows, total } = await listPendingInvitations(db, teamId, page);
  return { items: rows.map(toInvitation), total, limit: page.limit, offset: page.offset };
}

/**
 * Revokes an invitation so its link stops working. Revoking twice keeps the first time; an
 * invitation already accepted cannot be revoked (remove the member instead).
 */
export async function revokeInvitation(
  db: Db,
  user: CurrentUser,
  teamId: number,
  id: number,
): Promise<Invitation> {
  await requireMemberManager(db, user, teamId);
  return db.transaction(async (tx) => {
    const row = await findTeamInvitation(tx, teamId, id);
    if (!row) throw new AppError('not-found', 'No such invitation.');
    if (row.acceptedAt) {
      throw new AppError(
        'conflict',
        'This invitation has been accepted already; remove the member instead.',
      );
    }
    if (row.revokedAt) return toInvitation(row);
    const now = new Date();
    await markRevoked(tx, id, now);
    await recordAudit(tx, {
      actorId: user.id,
      teamId,
      action: 'invitation.revoked',
      entity: 'invitation',
      entityId: id,
      details: { email: row.email, role: row.role },
    });
    return toInvitation({ ...row, revokedAt: now });
  });
}
