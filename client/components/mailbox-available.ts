import { queryOptions } from '@tanstack/react-query';
import { ApiError, apiRequest } from '@client/api/api-client.ts';

/**
 * Whether the development mailbox exists on this server: its route answers 404 in production
 * like any unknown route, anything else (even "fake SMTP server not answering") means it exists.
 */
export const mailboxAvailableQuery = () =>
  queryOptions({
    queryKey: ['dev-mailbox', 'available'],
    queryFn: async ({ signal }) => {
      try {
        await apiRequest('/api/dev/mailbox?limit=1', { signal });
        return true;
      } catch (error) {
        return !(error instanceof ApiError && error.status === 404);
      }
    },
    staleTime: Infinity,
    retry: false,
  });
