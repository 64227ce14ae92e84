import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import { mailboxMessageSchema, mailboxPageSchema } from '@shared/api/mailbox.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { createApp } from '@server/app.ts';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { unusedPort } from './free-port.ts';

interface Served {
  url: string;
  close: () => Promise<void>;
}

let database: Database;
let fake: FakeSmtpServer;
const servers: Served[] = [];

/** The app as `npm start` runs it, with the fake SMTP server's reader in another "process". */
async function serveApp(settings: Record<string, string>): Promise<string> {
  const env = loadEnv({ SMTP_PORT: String(fake.port), ...settings });
  const app = createApp({ database, logger: pino({ level: 'silent' }), env });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  servers.push({
    url,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  });
  return url;
}

let devUrl: string;
beforeAll(async () => {
  database = createDatabase(inject('databaseUrl'), 2);
  fake = await startFakeSmtpServer({ port: 0, httpPort: 0, host: '127.0.0.1' });
  devUrl = await serveApp({ NODE_ENV: 'development', FAKE_SMTP_HTTP_PORT: String(fake.httpPort) });
});
afterAll(async () => {
  await Promise.all(servers.map((s) => s.close()));
  await fake?.close();
  await database?.pool.end();
});
beforeEach(() => fake.clear());

async function send(...subjects: string[]) {
  const transport = createMailTransport(loadEnv({ SMTP_PORT: String(fake.port) }));
  for (const subject of subjects) {
    await transport.sendMail({
      to: 'ines.probst@frame.example',
      subject,
      text: subject,
      html: `<p>${subject}</p>`,
    });
  }
}

describe('GET /api/dev/mailbox', () => {
  it('lists captured messages newest first, a page at a time', async () => {
    await send('First', 'Second', 'Third');
    const res = await fetch(`${devUrl}/api/dev/mailbox?limit=2`);
    expect(res.status).toBe(200);
    const page = mailboxPageSchema.parse(await res.json());
    expect(page).toMatchObject({ total: 3, limit: 2, offset: 0 });
    expect(page.items.map((m) => m.subject)).toEqual(['Third', 'Second']);
    expect(page.items[0]!.to).toEqual(['ines.probst@frame.example']);

    const next = mailboxPageSchema.parse(
      await (await fetch(`${devUrl}/api/dev/mailbox?limit=2&offset=2`)).json(),
    );
    expect(next.items.map((m) => m.subject)).toEqual(['First']);
  });

  it('answers one message with its bodies, and 404 for an id it does not hold', async () => {
    await send('Cleared: Cholesky blocked');
    const [summary] = mailboxPageSchema.parse(
      await (await fetch(`${devUrl}/api/dev/mailbox`)).json(),
    ).items;
    const res = await fetch(`${devUrl}/api/dev/mailbox/${summary!.id}`);
    expect(res.status).toBe(200);
    expect(mailboxMessageSchema.parse(await res.json())).toMatchObject({
      subject: 'Cleared: Cholesky blocked',
      text: 'Cleared: Cholesky blocked',
      html: '<p>Cleared: Cholesky blocked</p>',
    });

    const missing = await fetch(`${devUrl}/api/dev/mailbox/${summary!.id + 1000}`);
    expect(missing.status).toBe(404);
    expect(apiErrorSchema.parse(await missing.json()).error.code).toBe('not-found');
    expect((await fetch(`${devUrl}/api/dev/mailbox/abc`)).status).toBe(400);
    expect((await fetch(`${devUrl}/api/dev/mailbox?limit=0`)).status).toBe(400);
  });

  it('empties the mailbox on DELETE', async () => {
    await send('Gone soon');
    const res = await fetch(`${devUrl}/api/dev/mailbox`, { method: 'DELETE' });
    expect(res.status).toBe(204);
    expect(fake.messages()).toEqual([]);
    const page = mailboxPageSchema.parse(await (await fetch(`${devUrl}/api/dev/mailbox`)).json());
    expect(page.total).toBe(0);
  });

  it('is not there in production', async () => {
    await send('Invitation');
    const prodUrl = await serveApp({
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-production-secret-for-this-test',
      FAKE_SMTP_HTTP_PORT: String(fake.httpPort),
    });
    for (const [method, path] of [
      ['GET', '/api/dev/mailbox'],
      ['GET', '/api/dev/mailbox/1'],
      ['DELETE', '/api/dev/mailbox'],
    ] as const) {
      const res = await fetch(`${prodUrl}${path}`, { method });
      expect(res.status).toBe(404);
      expect(apiErrorSchema.parse(await res.json()).error.code).toBe('not-found');
    }
    expect(fake.messages()).toHaveLength(1);
  });

  it('is there in production when MAILBOX=on, as npm start sets it beside the fake SMTP server', async () => {
    await send('Invitation');
    const prodUrl = await serveApp({
      NODE_ENV: 'production',
      MAILBOX: 'on',
      SESSION_SECRET: 'a-production-secret-for-this-test',
      FAKE_SMTP_HTTP_PORT: String(fake.httpPort),
    });
    const res = await fetch(`${prodUrl}/api/dev/mailbox`);
    expect(res.status).toBe(200);
    expect(mailboxPageSchema.parse(await res.json()).total).toBe(1);
  });

  it('says so when the fake SMTP server is not running', async () => {
    const url = await serveApp({
      NODE_ENV: 'development',
      FAKE_SMTP_HTTP_PORT: String(await unusedPort()),
    });
    const res = await fetch(`${url}/api/dev/mailbox`);
    expect(res.status).toBe(500);
    expect(apiErrorSchema.parse(await res.json()).error.message).toMatch(/not answering/);
  });
});
