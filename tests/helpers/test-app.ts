import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { pino } from 'pino';
import { createApp } from '@server/app.ts';
import { createDatabase, type Database } from '@server/db/client.ts';

export interface RunningApp {
  url: string;
  database: Database;
  close: () => Promise<void>;
}

/** Starts the app in this process on a free loopback port; close() stops it and its pool. */
export async function startTestApp(databaseUrl: string, clientDir?: string): Promise<RunningApp> {
  const database = createDatabase(databaseUrl, 4);
  const app = createApp({ database, logger: pino({ level: 'silent' }), clientDir });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    database,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await database.pool.end();
    },
  };
}
