import type { Invitation } from '@shared/api/invitations.ts';
import type { InvitationWithInviter } from './invitations.repo.ts';

/** Where an invitation stands: a used or revoked one stays so; a pending one can lapse. */
export function invitationStatus(
  row: Pick<InvitationWithInviter, 'acceptedAt' | 'revokedAt' | 'expiresAt'>,
  now = new Date(),
): Invitation['status'] {
  if (row.acceptedAt) return 'accepted';
  if (row.revokedAt) return 'revoked';
  return row.expiresAt <= now ? 'expired' : 'pending';
}

export function toInvitation(row: InvitationWithInviter): Invitation {
  return {
    id: row.id,
    teamId: row.teamId,
    email: row.email,
    role: row.role,
    status: invitationStatus(row),
    invitedBy: { id: row.invitedBy, login: row.inviterLogin },
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    acceptedAt: row.acceptedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}
