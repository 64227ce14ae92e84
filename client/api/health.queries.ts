import { queryOptions } from '@tanstack/react-query';
import { healthSchema } from '@shared/api/health.ts';
import { apiGet } from './api-client.ts';

export const healthQueries = {
  all: () => ['health'] as const,
  status: () =>
    queryOptions({
      queryKey: [...healthQueries.all(), 'status'],
      queryFn: ({ signal }) => apiGet('/api/health', healthSchema, signal),
      refetchInterval: 30_000,
    }),
};
