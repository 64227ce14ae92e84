import { queryOptions } from '@tanstack/react-query';
import { apiGet, queryString } from '@client/api/api-client.ts';
import { candidateDetailSchema, candidatePageSchema } from '@shared/api/candidates.ts';
import { revisionSchema } from '@shared/api/revisions.ts';
import { trialPageSchema } from '@shared/api/trials.ts';
import type { CandidateState } from '@shared/states.ts';

export const candidateQueries = {
  all: () => ['candidates'] as const,
  list: (
    routineId: number,
    filter: { state?: CandidateState; limit?: number; offset?: number } = {},
  ) =>
    queryOptions({
      queryKey: [...candidateQueries.all(), 'list', routineId, filter],
      queryFn: ({ signal }) =>
        apiGet(
          `/api/routines/${routineId}/candidates${queryString({ limit: 100, ...filter })}`,
          candidatePageSchema,
          signal,
        ),
    }),
  detail: (candidateId: number) =>
    queryOptions({
      queryKey: [...candidateQueries.all(), 'detail', candidateId],
      queryFn: ({ signal }) =>
        apiGet(`/api/candidates/${candidateId}`, candidateDetailSchema, signal),
    }),
};

export const revisionQueries = {
  all: () => ['revisions'] as const,
  detail: (revisionId: number) =>
    queryOptions({
      queryKey: [...revisionQueries.all(), 'detail', revisionId],
      queryFn: ({ signal }) => apiGet(`/api/revisions/${revisionId}`, revisionSchema, signal),
      staleTime: Infinity, // revisions never change
    }),
  trials: (revisionId: number) =>
    queryOptions({
      queryKey: [...revisionQueries.all(), 'trials', revisionId],
      queryFn: ({ signal }) =>
        apiGet(`/api/revisions/${revisionId}/trials`, trialPageSchema, signal),
    }),
};
