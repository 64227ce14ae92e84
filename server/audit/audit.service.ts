import type { AuditPage } from '@shared/api/audit.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { requireTeamRole } from '@server/teams/team-access.ts';
import { auditReaders } from './audit.policy.ts';
import { listTeamAudit } from './audit.repo.ts';

/** A team's audit log, newest first (maintainers). */
export async function listAudit(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<AuditPage> {
  await requireTeamRole(db, user, teamId, auditReaders);
  const { rows, total } = await listTeamAudit(db, teamId, page);
  return {
    items: rows.map((r) => ({
      id: r.id,
      actor:
        r.actorId !== null && r.actorLogin !== null ? { id: r.actorId, login: r.actorLogin } : null,
      action: r.action,
      entity: r.entity,
      entityId: r.entityId,
      details: r.details,
      createdAt: r.createdAt.toISOString(),
    })),
    total,
    limit: page.limit,
    offset: page.offset,
  };
}
