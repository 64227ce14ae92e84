import { auditLog } from '@server/db/schema/audit-log.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export interface AuditRecord {
  /** Null for changes the system makes on its own (the worker). */
  actorId: number | null;
  teamId: number | null;
  /** What happened, `<entity>.<verb>`: `member.role-changed`, `routine.created`. */
  action: string;
  entity: string;
  entityId: number | null;
  /** The particulars a reader needs (old and new role, changed fields); never a secret. */
  details?: Record<string, unknown>;
}

/**
 * Writes one state change to the audit log. Pass the transaction that makes the change, so the
 * record and the change commit together or not at all.
 */
export async function recordAudit(db: DbOrTx, record: AuditRecord): Promise<void> {
  await db.insert(auditLog).values({ ...record, details: record.details ?? {} });
}
