import { queryOptions } from '@tanstack/react-query';
import { apiGet, apiSend } from '@client/api/api-client.ts';
import { mailboxMessageSchema, mailboxPageSchema } from '@shared/api/mailbox.ts';

export const mailboxQueries = {
  all: () => ['dev-mailbox'] as const,
  list: (offset: number) =>
    queryOptions({
      queryKey: [...mailboxQueries.all(), 'list', offset],
      queryFn: ({ signal }) =>
        apiGet(`/api/dev/mailbox?limit=50&offset=${offset}`, mailboxPageSchema, signal),
      retry: false,
    }),
  message: (id: number) =>
    queryOptions({
      queryKey: [...mailboxQueries.all(), 'message', id],
      queryFn: ({ signal }) => apiGet(`/api/dev/mailbox/${id}`, mailboxMessageSchema, signal),
      retry: false,
    }),
};

export const emptyMailbox = () => apiSend('DELETE', '/api/dev/mailbox');
