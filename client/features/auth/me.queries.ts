import { queryOptions } from '@tanstack/react-query';
import { ApiError, apiRequest } from '@client/api/api-client.ts';
import { meSchema, type Me } from '@shared/api/me.ts';

/** Who is signed in: `null` when nobody is (the API answers 401). */
export const meQueries = {
  all: () => ['me'] as const,
  current: () =>
    queryOptions({
      queryKey: meQueries.all(),
      queryFn: async ({ signal }): Promise<Me | null> => {
        try {
          return await apiRequest('/api/me', { schema: meSchema, signal });
        } catch (error) {
          if (error instanceof ApiError && error.code === 'unauthenticated') return null;
          throw error;
        }
      },
      staleTime: 60_000,
      retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 1,
    }),
};
