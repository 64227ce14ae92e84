import { pino } from 'pino';
import { loadEnv } from '@server/config/env.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';

/**
 * The web app and an in-process trial worker on one pg-boss queue over `databaseUrl`, with the
 * small limits the hardening suites use (2 s per call, 64 MB heap) and a 1 s retry delay. The
 * caller stops the queue (`queue.boss.stop`) and closes the app.
 */
export async function startAppWithWorker(
  databaseUrl: string,
  options: { schema?: string } = {},
): Promise<{ app: RunningApp; queue: PgBossQueue }> {
  const logger = pino({ level: 'silent' });
  const queue = await createPgBossQueue({
    databaseUrl,
    logger,
    ...(options.schema ? { schema: options.schema } : {}),
    trialJobs: { retryDelaySeconds: 1 },
  });
  const app = await startTestApp(databaseUrl, undefined, {}, queue);
  await startTrialWorker({
    boss: queue.boss,
    queue,
    db: app.database.db,
    env: loadEnv({ PUBLIC_URL: app.url }),
    logger,
    limits: { callTimeoutMs: 2_000, memoryLimitMb: 64 },
  });
  return { app, queue };
}
