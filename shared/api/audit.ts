import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';

/** One state change: who did what to which thing, with its particulars. */
export const auditEntrySchema = z.object({
  id: z.number().int().positive(),
  /** Null for changes made by the system (the worker). */
  actor: z.object({ id: z.number().int().positive(), login: z.string() }).nullable(),
  /** What happened, e.g. `member.role-changed`. */
  action: z.string(),
  entity: z.string(),
  entityId: z.number().int().nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.iso.datetime({ offset: true }),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;

/** `GET /api/teams/:teamId/audit`, newest first. */
export const auditPageSchema = pageSchema(auditEntrySchema);
export type AuditPage = z.infer<typeof auditPageSchema>;
