import type { CandidateSummary } from '@shared/api/candidates.ts';
import type { CandidateListRow } from './candidates.repo.ts';

export function toCandidateSummary(row: CandidateListRow): CandidateSummary {
  const { candidate } = row;
  return {
    id: candidate.id,
    routineId: candidate.routineId,
    title: candidate.title,
    state: candidate.state,
    author: row.author,
    latestRevision: row.latestRevision,
    createdAt: candidate.createdAt.toISOString(),
    updatedAt: candidate.updatedAt.toISOString(),
  };
}
