import v8 from 'node:v8';
import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { trials } from '@server/db/schema/trials.ts';
import type { TrialRow } from '@server/jobs/finished-trial.ts';
import { defaultTrialJobOptions } from '@server/jobs/pg-boss-queue.ts';
import { runTrialJob, type TrialLimits } from '@server/jobs/run-trial-job.ts';
import type { TrialQueue } from '@server/jobs/trial-queue.ts';

/**
 * Limits of the demo's trials: the worker's defaults for a call and memory, and a small timing
 * budget per size, so the whole load stays within a couple of minutes on two cores.
 */
export const demoTrialLimits: TrialLimits = {
  callTimeoutMs: 10_000,
  memoryLimitMb: 256,
  timingBudgetMs: 300,
};

/** Tries of one trial, as the worker's queue gives it (defaultTrialJobOptions: 1 + 2 retries). */
const TRIES = 1 + defaultTrialJobOptions.retryLimit;

/** A queue that keeps the trials the services queue, for the demo to run here or hand on. */
export interface DemoQueue extends TrialQueue {
  /** The trials queued since the last call. */
  take(): number[];
}

export function createDemoQueue(): DemoQueue {
  let queued: number[] = [];
  return {
    enqueueTrial: async (trialId) => void queued.push(trialId),
    stop: async () => {},
    take() {
      const taken = queued;
      queued = [];
      return taken;
    },
  };
}

export interface DemoTrialRunner {
  /**
   * Runs a queued trial through the worker's own job function (runTrialJob: the engine, the
   * progress writes, the final transaction that moves the candidate or judges the drift check)
   * and returns the finished row. With `optimiserOff`, V8's optimising compiler is switched off
   * in this process for the length of the trial, and on again afterwards.
   */
  run(trialId: number, options?: { optimiserOff?: boolean }): Promise<TrialRow>;
  /** How many trials ran. */
  count(): number;
}

export function createDemoTrialRunner(
  db: Db,
  env: Env,
  logger: Pick<Logger, 'info' | 'warn' | 'error'>,
): DemoTrialRunner {
  let count = 0;
  const deps = {
    db,
    env,
    logger,
    limits: demoTrialLimits,
    // Progress is for people watching a trial; nobody watches these, so write it rarely.
    progressIntervalMs: 60_000,
  };
  return {
    async run(trialId, options = {}) {
      if (options.optimiserOff) v8.setFlagsFromString('--no-opt');
      try {
        for (let attempt = 1; ; attempt++) {
          try {
            await runTrialJob(deps, trialId);
            break;
          } catch (err) {
            // A fault of the harness fails the job, and pg-boss tries it again; so does this.
            if (attempt >= TRIES) throw err;
            logger.warn(
              { err, trialId, attempt },
              'demo trial failed in the harness; trying again',
            );
          }
        }
      } finally {
        if (options.optimiserOff) v8.setFlagsFromString('--opt');
      }
      count += 1;
      const [row] = await db.select().from(trials).where(eq(trials.id, trialId));
      if (!row) throw new Error(`trial ${trialId} vanished`);
      return row;
    },
    count: () => count,
  };
}
