import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import type { BrowserContext } from 'playwright-core';
import { loadEnv, type Env } from '@server/config/env.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { users } from '@server/db/schema/users.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { deliverPendingEmail } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import type { TeamRole } from '@shared/roles.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import {
  fakeTrialQueue,
  type FakeTrialQueue,
} from '@tests/integration/server/candidates/fake-trial-queue.ts';
import { signInAs, type CookieJar } from '@tests/integration/server/auth/oauth-flow.ts';
import { addMember, insertTeam, type TeamRef } from '@tests/helpers/team-fixture.ts';
import type { TestUser } from '@tests/helpers/users.ts';
import { onCluster, withDatabase } from '@tests/helpers/cluster-database.ts';

/** A person signed in through the fake provider, with the session cookie a browser would hold. */
export interface SignedIn {
  id: number;
  login: string;
  jar: CookieJar;
}

/**
 * The served client for the review side: the app on a database of its own, the fake sign-in
 * provider, the fake SMTP server with its reader (so the development mailbox works), and an
 * in-memory trial queue (tests finish trials as the worker would).
 */
export interface ReviewSideWorld {
  app: RunningApp;
  /** The world's own database. */
  databaseUrl: string;
  env: Env;
  smtp: FakeSmtpServer;
  queue: FakeTrialQueue;
  team: TeamRef;
  signIn: (login: string, role: TeamRole) => Promise<SignedIn>;
  /** Gives a browser context the person's session. */
  enter: (context: BrowserContext, person: SignedIn) => Promise<void>;
  /** A JSON write as a signed-in person (cookie and same-origin Origin, as the browser sends). */
  send: (person: SignedIn, method: string, path: string, body?: unknown) => Promise<Response>;
  /** Hands the queued e-mail to the fake SMTP server, as the worker's sender does. */
  deliverMail: () => Promise<number>;
  close: () => Promise<void>;
}

export async function startReviewSideWorld(
  testDatabaseUrl: string,
  clientDir: string,
): Promise<ReviewSideWorld> {
  const name = `e2e_review_${process.pid}_${Date.now()}`;
  await onCluster(testDatabaseUrl, `create database "${name}"`);
  const databaseUrl = withDatabase(testDatabaseUrl, name);
  await migrateDatabase(databaseUrl);

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
  const db = app.database.db;
  const team = await insertTeam(db, 'Tragwerk Frame Analysis');
  const transport = createMailTransport(env);

  return {
    app,
    databaseUrl,
    env,
    smtp,
    queue,
    team,
    signIn: async (login, role) => {
      const { jar } = await signInAs({ app, fakeUrl, close: async () => {} }, login);
      const [row] = await db.select().from(users).where(eq(users.login, login));
      await addMember(db, team.id, { id: row!.id } as TestUser, role);
      return { id: row!.id, login, jar };
    },
    enter: async (context, person) => {
      await context.addCookies([
        { name: 'stablehand.sid', value: person.jar.get('stablehand.sid')!, url: app.url },
      ]);
    },
    send: (person, method, path, body) =>
      fetch(`${app.url}/api${path}`, {
        method,
        headers: {
          cookie: person.jar.header(),
          origin: app.url,
          'content-type': 'application/json',
        },
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      }),
    deliverMail: async () => {
      let sent = 0;
      for (;;) {
        const batch = await deliverPendingEmail(db, transport, { batchSize: 50 });
        sent += batch.sent;
        if (batch.claimed === 0) return sent;
      }
    },
    close: async () => {
      transport.close();
      await app.close();
      await smtp.close();
      fake.closeAllConnections();
      await new Promise<void>((resolve) => fake.close(() => resolve()));
      await onCluster(testDatabaseUrl, `drop database if exists "${name}" with (force)`);
    },
  };
}
