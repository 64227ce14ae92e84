import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import type { BrowserContext } from 'playwright-core';
import { loadEnv } from '@server/config/env.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { loadDemo } from '@server/demo/demo-load.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { deliverPendingEmail } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { parseWithNonFinite } from '@shared/json-numbers.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import {
  fakeTrialQueue,
  type FakeTrialQueue,
} from '@tests/integration/server/candidates/fake-trial-queue.ts';
import { signInAs, type CookieJar } from '@tests/integration/server/auth/oauth-flow.ts';
import { onCluster, withDatabase } from '@tests/helpers/cluster-database.ts';

/**
 * The served client over the demo team: a database of its own with the demo story loaded
 * (server/demo/, real trials), the fake sign-in provider, the fake SMTP server holding the
 * story's e-mail (so the development mailbox has it), and an in-memory trial queue that keeps
 * the trial the story leaves queued where nothing runs it.
 */
export interface DemoTeamWorld {
  app: RunningApp;
  smtp: FakeSmtpServer;
  queue: FakeTrialQueue;
  teamId: number;
  teamSlug: string;
  /** How long the demo load took, in seconds (the demo's own count). */
  loadSeconds: number;
  /** Signs a demo person in through the fake provider; the jar holds their session cookie. */
  signIn: (login: string) => Promise<CookieJar>;
  /** Gives a browser context the person's session. */
  enter: (context: BrowserContext, jar: CookieJar) => Promise<void>;
  /** A JSON read as a signed-in person; "Infinity" and "NaN" strings read as numbers, as the client does. */
  read: (jar: CookieJar, path: string) => Promise<unknown>;
  close: () => Promise<void>;
}

export async function startDemoTeamWorld(
  testDatabaseUrl: string,
  clientDir: string,
): Promise<DemoTeamWorld> {
  // The demo loads only into an instance without teams, so the world has a database of its own.
  const name = `e2e_demo_${process.pid}_${Date.now()}`;
  await onCluster(testDatabaseUrl, `create database "${name}"`);
  const databaseUrl = withDatabase(testDatabaseUrl, name);
  const drop = () => onCluster(testDatabaseUrl, `drop database if exists "${name}" with (force)`);
  try {
    await migrateDatabase(databaseUrl);
  } catch (err) {
    await drop();
    throw err;
  }

  const fake: Server = await new Promise((resolve) => {
    const s = createFakeGithubApp({ identities: demoIdentities }).listen(0, '127.0.0.1', () =>
      resolve(s),
    );
  });
  const fakeUrl = `http://127.0.0.1:${(fake.address() as AddressInfo).port}`;
  const smtp = await startFakeSmtpServer({ port: 0, httpPort: 0, host: '127.0.0.1' });
  const queue = fakeTrialQueue();
  const settings = {
    NODE_ENV: 'development',
    GITHUB_AUTHORIZE_URL: `${fakeUrl}/login/oauth/authorize`,
    GITHUB_TOKEN_URL: `${fakeUrl}/login/oauth/access_token`,
    GITHUB_PROFILE_URL: `${fakeUrl}/user`,
    SMTP_PORT: String(smtp.port),
    FAKE_SMTP_HTTP_PORT: String(smtp.httpPort),
  };
  const app = await startTestApp(databaseUrl, clientDir, settings, queue);
  const env = loadEnv({ PUBLIC_URL: app.url, ...settings });
  const transport = createMailTransport(env);
  const closeAll = async () => {
    transport.close();
    await app.close();
    await smtp.close();
    fake.closeAllConnections();
    await new Promise<void>((resolve) => fake.close(() => resolve()));
    await drop();
  };

  try {
    const db = app.database.db;
    const loaded = await loadDemo(db, env, { logger: pino({ level: 'silent' }) });
    if (!loaded.loaded) throw new Error(`the demo did not load: ${loaded.reason}`);
    // The story's e-mail goes to the fake SMTP server, as the worker's sender would hand it on.
    for (;;) {
      const batch = await deliverPendingEmail(db, transport, { batchSize: 50 });
      if (batch.claimed === 0) break;
    }
    const signInWorld = { app, fakeUrl, close: async () => {} };
    return {
      app,
      smtp,
      queue,
      teamId: loaded.teamId,
      teamSlug: loaded.teamSlug,
      loadSeconds: loaded.seconds,
      signIn: async (login) => (await signInAs(signInWorld, login)).jar,
      enter: async (context, jar) => {
        await context.addCookies([
          { name: 'stablehand.sid', value: jar.get('stablehand.sid')!, url: app.url },
        ]);
      },
      read: async (jar, path) => {
        const res = await fetch(`${app.url}/api${path}`, { headers: { cookie: jar.header() } });
        if (!res.ok) throw new Error(`GET /api${path} answered ${res.status}`);
        return parseWithNonFinite(await res.text());
      },
      close: closeAll,
    };
  } catch (err) {
    await closeAll();
    throw err;
  }
}
