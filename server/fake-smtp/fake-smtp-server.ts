import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { MailboxMessage } from '@shared/api/mailbox.ts';
import { toCapturedMessage } from './captured-message.ts';
import { startCapturedMailHttp } from './fake-smtp-http.ts';

export interface FakeSmtpOptions {
  /** SMTP port; 0 picks a free one. */
  port: number;
  host?: string;
  /** Port of the JSON reader (`GET /messages`); 0 picks a free one; omitted: no reader. */
  httpPort?: number;
  /** The oldest messages are dropped beyond this many. */
  capacity?: number;
}

export interface FakeSmtpServer {
  port: number;
  /** Port of the JSON reader, or null when none was asked for. */
  httpPort: number | null;
  /** Every captured message, oldest first. */
  messages(): MailboxMessage[];
  clear(): void;
  close(): Promise<void>;
}

const maxMessageBytes = 5 * 1024 * 1024;

/**
 * A local SMTP server that accepts every message without authentication or TLS, parses it and
 * keeps it in memory, so development and tests can read what the app sent. Listens on loopback.
 */
export async function startFakeSmtpServer(options: FakeSmtpOptions): Promise<FakeSmtpServer> {
  const host = options.host ?? '127.0.0.1';
  const capacity = options.capacity ?? 500;
  let inbox: MailboxMessage[] = [];
  let nextId = 1;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: maxMessageBytes,
    onData(stream, session, callback) {
      const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
      simpleParser(stream).then(
        (mail) => {
          if (stream.sizeExceeded) {
            callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
            return;
          }
          inbox.push(toCapturedMessage(nextId++, mail, envelopeTo, new Date()));
          if (inbox.length > capacity) inbox = inbox.slice(inbox.length - capacity);
          callback();
        },
        (err: unknown) => callback(err instanceof Error ? err : new Error(String(err))),
      );
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(options.port, host, () => {
      smtp.server.off('error', reject);
      resolve();
    });
  });
  const port = (smtp.server.address() as AddressInfo).port;

  const store = {
    messages: () => [...inbox],
    clear: () => {
      inbox = [];
    },
  };
  let http: Server | null = null;
  let httpPort: number | null = null;
  if (options.httpPort !== undefined) {
    try {
      ({ server: http, port: httpPort } = await startCapturedMailHttp(
        store,
        options.httpPort,
        host,
      ));
    } catch (err) {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      throw err;
    }
  }

  return {
    port,
    httpPort,
    ...store,
    close: async () => {
      const closing = [new Promise<void>((resolve) => smtp.close(() => resolve()))];
      if (http) {
        const server = http;
        server.closeAllConnections();
        closing.push(new Promise<void>((resolve) => server.close(() => resolve())));
      }
      await Promise.all(closing);
    },
  };
}
