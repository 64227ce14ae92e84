import { queryOptions } from '@tanstack/react-query';
import { apiGet, queryString } from '@client/api/api-client.ts';
import { routineDetailSchema, routinePageSchema } from '@shared/api/routines.ts';

export const routineQueries = {
  all: () => ['routines'] as const,
  list: (teamId: number, page: { limit?: number; offset?: number } = { limit: 100 }) =>
    queryOptions({
      queryKey: [...routineQueries.all(), 'list', teamId, page],
      queryFn: ({ signal }) =>
        apiGet(`/api/teams/${teamId}/routines${queryString(page)}`, routinePageSchema, signal),
    }),
  detail: (routineId: number) =>
    queryOptions({
      queryKey: [...routineQueries.all(), 'detail', routineId],
      queryFn: ({ signal }) => apiGet(`/api/routines/${routineId}`, routineDetailSchema, signal),
    }),
};
