import { and, count, desc, eq, gt, isNull } from 'drizzle-orm';
import type { TeamRole } from '@shared/roles.ts';
import type { Db } from '@server/db/client.ts';
import { invitations } from '@server/db/schema/invitations.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type InvitationRow = typeof invitations.$inferSelect;
export interface InvitationWithInviter extends InvitationRow {
  inviterLogin: string;
}

const withInviter = {
  id: invitations.id,
  teamId: invitations.teamId,
  email: invitations.email,
  role: invitations.role,
  tokenHash: invitations.tokenHash,
  invitedBy: invitations.invitedBy,
  createdAt: invitations.createdAt,
  expiresAt: invitations.expiresAt,
  acceptedAt: invitations.acceptedAt,
  acceptedBy: invitations.acceptedBy,
  revokedAt: invitations.revokedAt,
  inviterLogin: users.login,
};

export async function insertInvitation(
  tx: DbOrTx,
  values: {
    teamId: number;
    email: string;
    role: TeamRole;
    tokenHash: string;
    invitedBy: number;
    expiresAt: Date;
  },
): Promise<InvitationRow> {
  const [row] = await tx.insert(invitations).values(values).returning();
  return row!;
}

/** An invitation of this team (another team's answers null, like a missing one). */
export async function findTeamInvitation(
  db: DbOrTx,
  teamId: number,
  id: number,
): Promise<InvitationWithInviter | null> {
  const [row] = await db
    .select(withInviter)
    .from(invitations)
    .innerJoin(users, eq(users.id, invitations.invitedBy))
    .where(and(eq(invitations.id, id), eq(invitations.teamId, teamId)))
    .limit(1);
  return row ?? null;
}

/** A page of a team's pending invitations (not accepted, not revoked, not expired), newest first. */
export async function listPendingInvitations(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: InvitationWithInviter[]; total: number }> {
  const pending = and(
    eq(invitations.teamId, teamId),
    isNull(invitations.acceptedAt),
    isNull(invitations.revokedAt),
    gt(invitations.expiresAt, new Date()),
  );
  const [rows, [totals]] = await Promise.all([
    db
      .select(withInviter)
      .from(invitations)
      .innerJoin(users, eq(users.id, invitations.invitedBy))
      .where(pending)
      .orderBy(desc(invitations.createdAt), desc(invitations.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(invitations).where(pending),
  ]);
  return { rows, total: totals?.total ?? 0 };
}

export async function markRevoked(tx: DbOrTx, id: number, at: Date): Promise<void> {
  await tx.update(invitations).set({ revokedAt: at }).where(eq(invitations.id, id));
}

/** The invitation with this secret's hash, locked until the transaction ends (it is used once). */
export async function lockInvitationByHash(
  tx: DbOrTx,
  tokenHash: string,
): Promise<InvitationRow | null> {
  const [row] = await tx
    .select()
    .from(invitations)
    .where(eq(invitations.tokenHash, tokenHash))
    .for('update');
  return row ?? null;
}

export async function markAccepted(tx: DbOrTx, id: number, userId: number, at: Date) {
  await tx
    .update(invitations)
    .set({ acceptedAt: at, acceptedBy: userId })
    .where(eq(invitations.id, id));
}
