import { sql } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { Db } from '@server/db/client.ts';
import { runDriftChecks } from '@server/drift/drift-checks.service.ts';
import { oneTrialAtATime } from './one-trial-at-a-time.ts';
import { defaultTrialJobOptions, TRIAL_DEAD_JOB, type TrialJobData } from './pg-boss-queue.ts';
import { runTrialJob, type TrialJobDeps, type TrialJobResult } from './run-trial-job.ts';
import { markTrialGaveUp } from './trial-gave-up.ts';
import { DRIFT_JOB, TRIAL_JOB, type TrialQueue } from './trial-queue.ts';

export interface TrialWorkerDeps extends TrialJobDeps {
  boss: PgBoss;
  /** Where drift checks put the trials they create (the same pg-boss queue). */
  queue: TrialQueue;
  /**
   * Called once when a trial runs past its job's expiry (one-trial-at-a-time.ts); the worker
   * process ends itself then. Default: an error in the log.
   */
  onStuckTrial?: (trialId: number) => void;
  /** When a trial counts as stuck, in ms: its job's expiry (default the queue's default). */
  stuckAfterMs?: number;
}

/**
 * Subscribes this process to the job queues: `trial.run` with one job at a time (timing needs a
 * quiet core, so a worker never runs two trials), its dead letter, and `drift.check`.
 *
 * pg-boss stops waiting for a handler when the job's expiry passes (and retries the job) but
 * cannot stop the handler itself; the next trial waits until the abandoned one has ended, so two
 * trials never share the core, and one still running at its expiry is reported as stuck. The
 * abandoned try's results are then either written first (and the retry skips the completed
 * trial) or discarded.
 */
export async function startTrialWorker(deps: TrialWorkerDeps): Promise<void> {
  const { boss } = deps;
  const oneAtATime = oneTrialAtATime<TrialJobResult>((trialId) => runTrialJob(deps, trialId), {
    stuckAfterMs: deps.stuckAfterMs ?? defaultTrialJobOptions.expireInSeconds * 1000,
    onStuck:
      deps.onStuckTrial ??
      ((trialId) => deps.logger.error({ trialId }, 'trial still running after its job expired')),
  });

  await boss.work<TrialJobData>(
    TRIAL_JOB,
    { batchSize: 1, pollingIntervalSeconds: 0.5 },
    async ([job]) => {
      if (!job) return null;
      try {
        return await oneAtATime(job.data.trialId);
      } catch (err) {
        // A try that failed because the database went away (a restart) is reported to pg-boss
        // only once the database answers again: pg-boss does not await its own fail(), so a
        // failure reported into the outage is lost and the job waits for its expiry.
        await untilDatabaseAnswers(deps.db);
        throw err;
      }
    },
  );
  await boss.work<TrialJobData>(
    TRIAL_DEAD_JOB,
    { batchSize: 1, pollingIntervalSeconds: 2, includeMetadata: true },
    async ([job]) => (job ? markTrialGaveUp(deps, job.data.trialId, job.output) : null),
  );
  await boss.work(DRIFT_JOB, { batchSize: 1, pollingIntervalSeconds: 2 }, async () => {
    const started = await runDriftChecks(deps.db, deps.queue);
    deps.logger.info({ count: started.length }, 'drift checks queued');
    return { started };
  });
}

/** Waits until the database answers a query, or `limitMs` has passed. */
async function untilDatabaseAnswers(db: Db, limitMs = 60_000, everyMs = 250): Promise<void> {
  const deadline = Date.now() + limitMs;
  while (Date.now() < deadline) {
    try {
      await db.execute(sql`select 1`);
      return;
    } catch {
      await new Promise((resolve) => setTimeout(resolve, everyMs));
    }
  }
}
