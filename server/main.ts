import type { AddressInfo } from 'node:net';
import { createApp } from './app.ts';
import { loadEnv } from './config/env.ts';
import { createDatabase } from './db/client.ts';
import { createLogger } from './http/logger.ts';
import { createPgBossQueue } from './jobs/pg-boss-queue.ts';
import { closeKernelCheck, warmKernelCheck } from './kernel-check/kernel-check-pool.ts';

const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL);
const database = createDatabase(env.DATABASE_URL);
const clientDir = env.CLIENT_DIR ?? (env.NODE_ENV === 'production' ? 'dist/client' : undefined);
const queue = await createPgBossQueue({
  databaseUrl: env.DATABASE_URL,
  logger,
  schema: env.PGBOSS_SCHEMA,
});
const app = createApp({ database, logger, env, clientDir, queue });

const server = app.listen(env.PORT, env.HOST, () => {
  const { port } = server.address() as AddressInfo;
  logger.info({ port }, 'listening');
  console.log(`Stablehand is serving at http://${env.HOST}:${port}/`);
  // The type-check threads parse TypeScript's lib files now rather than on the first submission.
  warmKernelCheck().catch((err: unknown) => logger.warn({ err }, 'type-check threads not warmed'));
});

function shutdown(signal: string) {
  logger.info({ signal }, 'shutting down');
  server.close(() => {
    void Promise.allSettled([queue.stop(), closeKernelCheck()]).finally(() =>
      database.pool.end().finally(() => process.exit(0)),
    );
  });
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
// A promise nobody awaited (a database connection lost mid-query in a library) must not end the
// web server for every other request on Node 20: log it and keep serving.
process.on('unhandledRejection', (reason: unknown) => {
  logger.error({ err: reason }, 'unhandled rejection; the server carries on');
});
