import { queryOptions } from '@tanstack/react-query';
import { apiRequest } from '@client/api/api-client.ts';
import { trialDetailSchema } from '@shared/api/trials.ts';

export const trialQueries = {
  all: () => ['trials'] as const,
  detail: (trialId: number) =>
    queryOptions({
      queryKey: [...trialQueries.all(), 'detail', trialId],
      // Non-finite metrics travel as strings ("Infinity", "NaN"); read them back as numbers.
      queryFn: ({ signal }) =>
        apiRequest(`/api/trials/${trialId}`, {
          schema: trialDetailSchema,
          signal,
          nonFinite: true,
        }),
    }),
};

/** The CSV export of a trial (one line per matrix), served as an attachment by the API. */
export const trialCsvHref = (trialId: number) => `/api/trials/${trialId}/export.csv`;
