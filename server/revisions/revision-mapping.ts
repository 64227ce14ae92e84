import type { Revision, RevisionSummary } from '@shared/api/revisions.ts';
import type { RevisionWithCreator } from './revisions.repo.ts';

export function toRevisionSummary({ revision, createdBy }: RevisionWithCreator): RevisionSummary {
  return {
    id: revision.id,
    candidateId: revision.candidateId,
    number: revision.number,
    sourceHash: revision.sourceHash,
    errorCount: revision.diagnostics.length,
    createdBy,
    createdAt: revision.createdAt.toISOString(),
  };
}

export function toRevision(found: RevisionWithCreator): Revision {
  return {
    ...toRevisionSummary(found),
    source: found.revision.source,
    diagnostics: found.revision.diagnostics,
  };
}
