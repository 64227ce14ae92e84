import { asc, desc, eq } from 'drizzle-orm';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { users } from '@server/db/schema/users.ts';
import { personColumns, type PersonRow } from '@server/candidates/candidates.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type RevisionRow = typeof revisions.$inferSelect;

export interface RevisionWithCreator {
  revision: RevisionRow;
  createdBy: PersonRow;
}

export async function findRevision(db: DbOrTx, id: number): Promise<RevisionWithCreator | null> {
  const [row] = await db
    .select({ revision: revisions, createdBy: personColumns })
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.id, id))
    .limit(1);
  return row ?? null;
}

/** A candidate's revisions, oldest first. */
export async function revisionsOf(db: DbOrTx, candidateId: number): Promise<RevisionWithCreator[]> {
  return db
    .select({ revision: revisions, createdBy: personColumns })
    .from(revisions)
    .innerJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.candidateId, candidateId))
    .orderBy(asc(revisions.number));
}

/** The candidate's newest revision (every candidate has at least one). */
export async function latestRevisionOf(db: DbOrTx, candidateId: number): Promise<RevisionRow> {
  const [row] = await db
    .select()
    .from(revisions)
    .where(eq(revisions.candidateId, candidateId))
    .orderBy(desc(revisions.number))
    .limit(1);
  if (!row) throw new Error(`candidate ${candidateId} has no revision`);
  return row;
}

/** Stores the next revision; call with the candidate row locked, so numbers do not collide. */
export async function insertNextRevision(
  tx: DbOrTx,
  values: {
    candidateId: number;
    source: string;
    sourceHash: string;
    diagnostics: KernelDiagnostic[];
    checkedWith: string;
    createdBy: number;
  },
): Promise<RevisionRow> {
  const [last] = await tx
    .select({ number: revisions.number })
    .from(revisions)
    .where(eq(revisions.candidateId, values.candidateId))
    .orderBy(desc(revisions.number))
    .limit(1);
  const [row] = await tx
    .insert(revisions)
    .values({ ...values, number: (last?.number ?? 0) + 1 })
    .returning();
  return row!;
}
