import { count, desc, eq } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { users } from '@server/db/schema/users.ts';

export interface AuditRow {
  id: number;
  action: string;
  entity: string;
  entityId: number | null;
  details: Record<string, unknown>;
  createdAt: Date;
  actorId: number | null;
  actorLogin: string | null;
}

/** A page of a team's audit log, newest first, and how many entries it has in all. */
export async function listTeamAudit(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: AuditRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select({
        id: auditLog.id,
        action: auditLog.action,
        entity: auditLog.entity,
        entityId: auditLog.entityId,
        details: auditLog.details,
        createdAt: auditLog.createdAt,
        actorId: auditLog.actorId,
        actorLogin: users.login,
      })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(eq(auditLog.teamId, teamId))
      .orderBy(desc(auditLog.createdAt), desc(auditLog.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(auditLog).where(eq(auditLog.teamId, teamId)),
  ]);
  return { rows, total: totals?.total ?? 0 };
}
