import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { loadEnv } from '@server/config/env.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import { startOutboxSender } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import type { SignInWorld } from '../auth/oauth-flow.ts';

/**
 * Everything the review process needs, each part real and on a free loopback port: the fake
 * sign-in provider, the fake SMTP server with its JSON reader, the app with a pg-boss queue, a
 * trial worker and the outbox sender delivering over SMTP. Give it a database of its own (the
 * outbox sender would otherwise deliver other test files' mail).
 */
export interface ProcessWorld extends SignInWorld {
  smtp: FakeSmtpServer;
  queue: PgBossQueue;
}

export async function startProcessWorld(databaseUrl: string): Promise<ProcessWorld> {
  const logger = pino({ level: 'silent' });
  const fake: Server = await new Promise((resolve) => {
    const s = createFakeGithubApp({ identities: demoIdentities }).listen(0, '127.0.0.1', () =>
      resolve(s),
    );
  });
  const fakeUrl = `http://127.0.0.1:${(fake.address() as AddressInfo).port}`;
  const smtp = await startFakeSmtpServer({ port: 0, httpPort: 0 });
  const mailEnv = {
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtp.port),
    FAKE_SMTP_HTTP_PORT: String(smtp.httpPort),
  };
  const queue = await createPgBossQueue({
    databaseUrl,
    logger,
    trialJobs: { retryDelaySeconds: 1 },
  });
  const app: RunningApp = await startTestApp(
    databaseUrl,
    undefined,
    {
      GITHUB_AUTHORIZE_URL: `${fakeUrl}/login/oauth/authorize`,
      GITHUB_TOKEN_URL: `${fakeUrl}/login/oauth/access_token`,
      GITHUB_PROFILE_URL: `${fakeUrl}/user`,
      ...mailEnv,
    },
    queue,
  );
  // The worker's links in e-mail point at the app, as in a deployment where both share PUBLIC_URL.
  const workerEnv = loadEnv({ PUBLIC_URL: app.url, ...mailEnv });
  await startTrialWorker({
    boss: queue.boss,
    queue,
    db: app.database.db,
    env: workerEnv,
    logger,
    limits: { callTimeoutMs: 2_000, memoryLimitMb: 64 },
  });
  const outbox = startOutboxSender({
    db: app.database.db,
    transport: createMailTransport(workerEnv),
    logger,
    intervalMs: 250,
  });

  return {
    app,
    fakeUrl,
    smtp,
    queue,
    close: async () => {
      await outbox.stop();
      await queue.boss.stop({ graceful: false, wait: true });
      await app.close();
      await smtp.close();
      fake.closeAllConnections();
      await new Promise<void>((resolve) => fake.close(() => resolve()));
    },
  };
}
