import type { Logger } from 'pino';
import type { Env } from '@server/config/env.ts';
import { createDatabase } from '@server/db/client.ts';
import { scheduleDriftChecks } from '@server/drift/drift-schedule.ts';
import { startOutboxSender } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { createTrialProcess } from '@sandbox/trial-process/trial-process.ts';
import { createPgBossQueue } from './pg-boss-queue.ts';
import { startTrialWorker } from './trial-worker.ts';

export interface RunningWorker {
  /**
   * Stops taking jobs, lets the trial in hand run on for up to WORKER_STOP_GRACE_SECONDS, then
   * abandons it: pg-boss marks the abandoned job failed, which counts as a try and schedules
   * the retry after its delay, and the retry starts the trial afresh. Results are only ever
   * written in one final transaction, so an abandoned try leaves none behind.
   */
  stop(): Promise<void>;
}

/**
 * The worker process's parts: the database, the pg-boss consumer of `trial.run` (one trial at a
 * time), its dead letter and `drift.check`, the drift-check schedule and (unless turned off)
 * the outbox sender. Trials run in a child process kept across trials (the trial process): one
 * that overruns TRIAL_DEADLINE_SECONDS or TRIAL_PROCESS_MEMORY_MB is killed and the trial ends
 * as trial-failed, and a fresh process is started at once for the next.
 */
export async function startWorkerProcess(env: Env, logger: Logger): Promise<RunningWorker> {
  const database = createDatabase(env.DATABASE_URL, 4);
  const queue = await createPgBossQueue({
    databaseUrl: env.DATABASE_URL,
    logger,
    schema: env.PGBOSS_SCHEMA,
    maintenanceIntervalSeconds: env.JOB_MAINTENANCE_SECONDS,
  });
  const trialProcess = createTrialProcess({
    deadlineMs: env.TRIAL_DEADLINE_SECONDS * 1000,
    memoryMb: env.TRIAL_PROCESS_MEMORY_MB,
    keepWarm: true,
  });
  // It takes seconds to load the engine and TypeScript: start it before the first job.
  trialProcess.warm();
  await startTrialWorker({
    boss: queue.boss,
    runTrial: (input) => trialProcess.run(input),
    queue,
    db: database.db,
    env,
    logger,
    stuckAfterMs: queue.trialJobs.expireInSeconds * 1000,
    // The last resort, should a trial outlive its job although the trial process's deadline is
    // shorter: ending the worker ends its trial process too; the job's retry (or its dead letter)
    // records the trial, and the supervisor (npm start's loop) starts a fresh worker.
    onStuckTrial: (trialId) => {
      logger.fatal({ trialId }, 'trial stuck past its job expiry; the worker exits');
      process.exit(75);
    },
    limits: {
      callTimeoutMs: env.TRIAL_CALL_TIMEOUT_MS,
      memoryLimitMb: env.TRIAL_MEMORY_LIMIT_MB,
      timingBudgetMs: env.TRIAL_TIMING_BUDGET_MS,
    },
  });
  await scheduleDriftChecks(queue.boss, env.DRIFT_CHECK_CRON);
  const outbox = env.WORKER_SENDS_EMAIL
    ? startOutboxSender({ db: database.db, transport: createMailTransport(env), logger })
    : null;
  logger.info({ schema: env.PGBOSS_SCHEMA }, 'worker started');

  return {
    async stop() {
      await outbox?.stop();
      await queue.boss.stop({
        graceful: true,
        wait: true,
        timeout: env.WORKER_STOP_GRACE_SECONDS * 1000,
      });
      // A trial still running after the grace period is abandoned with its process.
      await trialProcess.close();
      // A trial abandoned above may still hold a connection; do not wait for it for long.
      await Promise.race([
        database.pool.end(),
        new Promise((resolve) => setTimeout(resolve, 2000).unref()),
      ]);
    },
  };
}
