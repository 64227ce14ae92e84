import { queryOptions } from '@tanstack/react-query';
import { apiGet, queryString } from '@client/api/api-client.ts';
import { teamDetailSchema, teamPageSchema } from '@shared/api/teams.ts';

export const teamQueries = {
  all: () => ['teams'] as const,
  list: (page: { limit?: number; offset?: number } = {}) =>
    queryOptions({
      queryKey: [...teamQueries.all(), 'list', page],
      queryFn: ({ signal }) => apiGet(`/api/teams${queryString(page)}`, teamPageSchema, signal),
    }),
  detail: (teamId: number) =>
    queryOptions({
      queryKey: [...teamQueries.all(), 'detail', teamId],
      queryFn: ({ signal }) => apiGet(`/api/teams/${teamId}`, teamDetailSchema, signal),
    }),
};
