import type { AcceptedInvitation, AcceptInvitation } from '@shared/api/invitations.ts';
import { hashSecret } from '@server/auth/api-token-secret.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { findMember, insertMembership, setMemberRole } from '@server/members/members.repo.ts';
import { higherRole } from '@server/members/role-rank.ts';
import { lockTeam } from '@server/teams/teams.repo.ts';
import { invitationStatus } from './invitation-mapping.ts';
import { lockInvitationByHash, markAccepted, type InvitationRow } from './invitations.repo.ts';

/** Why a link can no longer be used, in words the person can act on. */
function refusal(row: InvitationRow): AppError | null {
  const status = invitationStatus(row);
  if (status === 'accepted') {
    return new AppError('conflict', 'This invitation has been used already; each link works once.');
  }
  if (status === 'revoked') {
    return new AppError(
      'conflict',
      'This invitation was revoked by a maintainer of the team; ask them for a new one.',
    );
  }
  if (status === 'expired') {
    const day = row.expiresAt.toISOString().slice(0, 10);
    return new AppError(
      'conflict',
      `This invitation expired on ${day}; ask a maintainer of the team for a new one.`,
    );
  }
  return null;
}

/** Makes the person a member with the invited role, or raises their role; says what happened. */
async function join(tx: DbOrTx, user: CurrentUser, row: InvitationRow, teamName: string) {
  const member = await findMember(tx, row.teamId, user.id);
  const audit = { actorId: user.id, teamId: row.teamId, entity: 'member', entityId: user.id };
  if (!member) {
    await insertMembership(tx, { teamId: row.teamId, userId: user.id, role: row.role });
    await recordAudit(tx, {
      ...audit,
      action: 'member.added',
      details: { login: user.login, role: row.role, invitationId: row.id },
    });
    return {
      role: row.role,
      outcome: 'joined' as const,
      message: `You joined ${teamName} as ${row.role}.`,
    };
  }
  const role = higherRole(member.role, row.role);
  if (role === member.role) {
    return {
      role,
      outcome: 'role-kept' as const,
      message: `You were already ${member.role} in ${teamName}, which is at least the invited role ${row.role}; you stay ${member.role}.`,
    };
  }
  await setMemberRole(tx, row.teamId, user.id, role);
  await recordAudit(tx, {
    ...audit,
    action: 'member.role-changed',
    details: { login: user.login, from: member.role, to: role, invitationId: row.id },
  });
  return {
    role,
    outcome: 'role-raised' as const,
    message: `You were already ${member.role} in ${teamName}; the invitation raises you to ${role}.`,
  };
}

/**
 * Accepts an invitation by the secret from its link, for whoever is signed in (the address it
 * was sent to need not be their GitHub address: holding the link is what counts). A link works
 * once, until it expires or is revoked.
 */
export async function acceptInvitation(
  db: Db,
  user: CurrentUser,
  input: AcceptInvitation,
): Promise<AcceptedInvitation> {
  return db.transaction(async (tx) => {
    const row = await lockInvitationByHash(tx, hashSecret(input.token));
    if (!row) throw new AppError('not-found', 'This invitation link is not valid.');
    const refused = refusal(row);
    if (refused) throw refused;
    const team = await lockTeam(tx, row.teamId);
    if (!team) throw new AppError('not-found', 'This invitation link is not valid.');
    const result = await join(tx, user, row, team.name);
    await markAccepted(tx, row.id, user.id, new Date());
    await recordAudit(tx, {
      actorId: user.id,
      teamId: row.teamId,
      action: 'invitation.accepted',
      entity: 'invitation',
      entityId: row.id,
      details: { email: row.email, role: row.role, login: user.login, outcome: result.outcome },
    });
    return { team: { id: team.id, slug: team.slug, name: team.name }, ...result };
  });
}
