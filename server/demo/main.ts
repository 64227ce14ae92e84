import { loadEnv } from '@server/config/env.ts';
import { createDatabase } from '@server/db/client.ts';
import { createLogger } from '@server/http/logger.ts';
import { createPgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { loadDemo } from './demo-load.ts';

// `npm run demo:load` (node --no-node-snapshot --no-concurrent-recompilation, like the worker:
// the demo runs real trials). Loads the demo team into DATABASE_URL when it has no teams, then
// hands the trials the story leaves queued to the job queue, for a worker to run.
const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL).child({ process: 'demo' });
const database = createDatabase(env.DATABASE_URL, 2);

try {
  const result = await loadDemo(database.db, env, { logger });
  if (!result.loaded) {
    console.error(`[stablehand] demo data skipped: ${result.reason}`);
  } else {
    if (result.queuedTrialIds.length > 0) {
      const queue = await createPgBossQueue({
        databaseUrl: env.DATABASE_URL,
        logger,
        schema: env.PGBOSS_SCHEMA,
      });
      try {
        for (const trialId of result.queuedTrialIds) await queue.enqueueTrial(trialId);
      } finally {
        await queue.stop();
      }
    }
    console.error(
      `[stablehand] demo data loaded: team ${result.teamSlug}, ${result.trialsRun} trials run, ` +
        `${result.queuedTrialIds.length} left queued for the worker, ${result.seconds.toFixed(1)} s`,
    );
  }
} catch (err) {
  logger.error({ err }, 'demo load failed');
  console.error('[stablehand] demo data not loaded; nothing was written');
  process.exitCode = 1;
} finally {
  await database.pool.end();
}
