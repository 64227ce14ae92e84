import type { MailboxMessage, MailboxPage } from '@shared/api/mailbox.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import { AppError } from '@server/http/errors.ts';
import type { MailboxReader } from './mailbox-reader.ts';

/** A page of captured messages, newest first (ids grow with arrival). */
export async function listMailbox(
  reader: MailboxReader,
  query: PaginationQuery,
): Promise<MailboxPage> {
  const all = (await reader.list()).sort((a, b) => b.id - a.id);
  const items = all
    .slice(query.offset, query.offset + query.limit)
    .map(({ id, from, to, subject, date }) => ({ id, from, to, subject, date }));
  return { items, total: all.length, limit: query.limit, offset: query.offset };
}

export async function getMailboxMessage(
  reader: MailboxReader,
  id: number,
): Promise<MailboxMessage> {
  const message = (await reader.list()).find((m) => m.id === id);
  if (!message) throw new AppError('not-found', 'No such message in the mailbox.');
  return message;
}

export async function clearMailbox(reader: MailboxReader): Promise<void> {
  await reader.clear();
}
