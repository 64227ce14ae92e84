import { loadEnv, type Env } from '@server/config/env.ts';

/**
 * The worker's settings now live in config/env.ts with every other setting, parsed once by
 * loadEnv. This alias remains only for server/demo/main.ts, which is being written at the same
 * time; once it reads `loadEnv().PGBOSS_SCHEMA`, delete this file.
 */
export type WorkerSettings = Env;

export function loadWorkerSettings(source: NodeJS.ProcessEnv = process.env): WorkerSettings {
  return loadEnv(source);
}
