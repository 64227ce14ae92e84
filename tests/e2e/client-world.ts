import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import pg from 'pg';
import { pino } from 'pino';
import { loadEnv } from '@server/config/env.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import { withDatabase } from '@tests/helpers/cluster-database.ts';

/**
 * The served client with everything its pages need, each part real and on a free loopback
 * port: the app serving `clientDir`, the fake sign-in provider and a pg-boss queue with a trial
 * worker. It runs on a database of its own (created from the test database's cluster and dropped
 * on close), so its queue never takes another test file's jobs.
 */
export interface ClientWorld {
  app: RunningApp;
  fakeUrl: string;
  queue: PgBossQueue;
  close: () => Promise<void>;
}

export async function startClientWorld(
  testDatabaseUrl: string,
  clientDir: string,
): Promise<ClientWorld> {
  const name = `e2e_client_${process.pid}_${Date.now()}`;
  const admin = new pg.Client({ connectionString: withDatabase(testDatabaseUrl, 'postgres') });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();
  const databaseUrl = withDatabase(testDatabaseUrl, name);
  await migrateDatabase(databaseUrl);

  const logger = pino({ level: 'silent' });
  const fake: Server = await new Promise((resolve) => {
    const s = createFakeGithubApp({ identities: demoIdentities }).listen(0, '127.0.0.1', () =>
      resolve(s),
    );
  });
  const fakeUrl = `http://127.0.0.1:${(fake.address() as AddressInfo).port}`;
  const queue = await createPgBossQueue({
    databaseUrl,
    logger,
    trialJobs: { retryDelaySeconds: 1 },
  });
  const app = await startTestApp(
    databaseUrl,
    clientDir,
    {
      GITHUB_AUTHORIZE_URL: `${fakeUrl}/login/oauth/authorize`,
      GITHUB_TOKEN_URL: `${fakeUrl}/login/oauth/access_token`,
      GITHUB_PROFILE_URL: `${fakeUrl}/user`,
    },
    queue,
  );
  await startTrialWorker({
    boss: queue.boss,
    queue,
    db: app.database.db,
    env: loadEnv({ PUBLIC_URL: app.url }),
    logger,
    limits: { callTimeoutMs: 2_000, memoryLimitMb: 64 },
  });

  return {
    app,
    fakeUrl,
    queue,
    close: async () => {
      await queue.boss.stop({ graceful: false, wait: true });
      await app.close();
      fake.closeAllConnections();
      await new Promise<void>((resolve) => fake.close(() => resolve()));
      const cleaner = new pg.Client({
        connectionString: withDatabase(testDatabaseUrl, 'postgres'),
      });
      await cleaner.connect();
      await cleaner.query(`drop database if exists "${name}" with (force)`);
      await cleaner.end();
    },
  };
}
