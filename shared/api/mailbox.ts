import { z } from 'zod';
import { pageSchema, paginationQuerySchema } from './pagination.ts';

/** One e-mail captured by the local fake SMTP server (development and tests only). */
export const mailboxMessageSchema = z.object({
  id: z.number().int().positive(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  /** The HTML part, or null when the message had none. */
  html: z.string().nullable(),
  /** When the fake server received it (ISO 8601). */
  date: z.iso.datetime({ offset: true }),
});
export type MailboxMessage = z.infer<typeof mailboxMessageSchema>;

/** A row of the mailbox list: the envelope without the bodies. */
export const mailboxSummarySchema = mailboxMessageSchema.pick({
  id: true,
  from: true,
  to: true,
  subject: true,
  date: true,
});
export type MailboxSummary = z.infer<typeof mailboxSummarySchema>;

/** `GET /api/dev/mailbox?limit&offset`, newest first. */
export const mailboxQuerySchema = paginationQuerySchema;
export const mailboxPageSchema = pageSchema(mailboxSummarySchema);
export type MailboxPage = z.infer<typeof mailboxPageSchema>;
