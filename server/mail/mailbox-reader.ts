import { z } from 'zod';
import { mailboxMessageSchema, type MailboxMessage } from '@shared/api/mailbox.ts';
import type { Env } from '@server/config/env.ts';
import { AppError } from '@server/http/errors.ts';

/** Where the development mailbox reads captured messages from. */
export interface MailboxReader {
  /** Every captured message, in any order. */
  list(): Promise<MailboxMessage[]>;
  clear(): Promise<void>;
}

const messagesSchema = z.array(mailboxMessageSchema);

function notAnswering(baseUrl: string): AppError {
  return new AppError(
    'internal',
    `The fake SMTP server's reader at ${baseUrl} is not answering; is it running?`,
  );
}

/** Reads the fake SMTP server's JSON reader, which may run in another process. */
export function httpMailboxReader(baseUrl: string, timeoutMs = 3000): MailboxReader {
  const url = `${baseUrl.replace(/\/$/, '')}/messages`;
  const call = async (method: 'GET' | 'DELETE') => {
    let res: Response;
    try {
      res = await fetch(url, { method, signal: AbortSignal.timeout(timeoutMs) });
    } catch {
      throw notAnswering(baseUrl);
    }
    if (!res.ok) throw notAnswering(baseUrl);
    return res;
  };
  return {
    list: async () => messagesSchema.parse(await (await call('GET')).json()),
    clear: async () => {
      await call('DELETE');
    },
  };
}

/** The reader the app uses: the fake SMTP server's JSON reader on SMTP_HOST. */
export function mailboxReaderFromEnv(env: Env): MailboxReader {
  return httpMailboxReader(`http://${env.SMTP_HOST}:${env.FAKE_SMTP_HTTP_PORT}`);
}
