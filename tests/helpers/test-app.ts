import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { createApp } from '@server/app.ts';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';

export interface RunningApp {
  url: string;
  database: Database;
  close: () => Promise<void>;
}

/**
 * Starts the app in this process on a free loopback port; close() stops it and its pool. The
 * server listens before the app is built so that PUBLIC_URL (sign-in callback, CSRF origin) is
 * the real address; `env` adds or overrides settings (for example the fake provider's URLs);
 * `queue` receives the trials that submissions queue (tests pass an in-memory one).
 */
export async function startTestApp(
  databaseUrl: string,
  clientDir?: string,
  env: Record<string, string | undefined> = {},
  queue?: TrialQueue,
): Promise<RunningApp> {
  const database = createDatabase(databaseUrl, 4);
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const url = `http://127.0.0.1:${port}`;
  const app = createApp({
    database,
    logger: pino({ level: 'silent' }),
    clientDir,
    env: loadEnv({ PUBLIC_URL: url, ...env }),
    queue,
  });
  server.on('request', app);
  return {
    url,
    database,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await database.pool.end();
    },
  };
}
