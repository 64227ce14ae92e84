import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { DRIFT_JOB, TRIAL_JOB, type TrialQueue } from './trial-queue.ts';

/** Where a `trial.run` job goes after its last failed try; its handler marks the trial errored. */
export const TRIAL_DEAD_JOB = 'trial.run.dead';

/** The payload of `trial.run` (and of its dead letter). */
export interface TrialJobData {
  trialId: number;
}

export interface TrialJobOptions {
  /** Tries after the first: a harness fault or a dead worker gets this many more. */
  retryLimit: number;
  retryDelaySeconds: number;
  /**
   * How long one try may stay active. A trial takes minutes at most; a worker that died keeps
   * its job active until then, after which pg-boss's maintenance hands it to another worker.
   */
  expireInSeconds: number;
}

export const defaultTrialJobOptions: TrialJobOptions = {
  retryLimit: 2,
  retryDelaySeconds: 10,
  expireInSeconds: 30 * 60,
};

export interface PgBossQueueOptions {
  databaseUrl: string;
  logger: Pick<Logger, 'error'>;
  /** pg-boss's own schema (kept out of drizzle-kit); default `pgboss`. */
  schema?: string;
  /** How often expired jobs are turned into retries (pg-boss maintenance); default 60 s. */
  maintenanceIntervalSeconds?: number;
  trialJobs?: Partial<TrialJobOptions>;
  /** Connections of pg-boss's own pool. */
  poolSize?: number;
}

export type PgBossQueue = TrialQueue & { boss: PgBoss; trialJobs: TrialJobOptions };

/**
 * Starts pg-boss 10 on the application database and creates the queues this service uses:
 * `send` to a queue that does not exist resolves to null instead of failing (stack.md §5), so
 * every queue is created here, before anything is sent. The dead-letter queue comes first
 * because `trial.run` refers to it. Creating an existing queue changes nothing.
 */
export async function createPgBossQueue(options: PgBossQueueOptions): Promise<PgBossQueue> {
  const trialJobs = { ...defaultTrialJobOptions, ...options.trialJobs };
  const boss = new PgBoss({
    connectionString: options.databaseUrl,
    schema: options.schema ?? 'pgboss',
    max: options.poolSize ?? 4,
    maintenanceIntervalSeconds: options.maintenanceIntervalSeconds ?? 60,
  });
  // Without a listener an error event would crash the process; pg-boss retries on its own.
  boss.on('error', (err) => options.logger.error({ err }, 'job queue error'));
  await boss.start();

  const jobOptions = {
    retryLimit: trialJobs.retryLimit,
    retryDelay: trialJobs.retryDelaySeconds,
    expireInSeconds: trialJobs.expireInSeconds,
    deadLetter: TRIAL_DEAD_JOB,
  };
  await boss.createQueue(TRIAL_DEAD_JOB, {
    name: TRIAL_DEAD_JOB,
    retryLimit: 5,
    retryDelay: 30,
  });
  await boss.createQueue(TRIAL_JOB, { name: TRIAL_JOB, ...jobOptions });
  await boss.createQueue(DRIFT_JOB, { name: DRIFT_JOB, retryLimit: 1, expireInSeconds: 10 * 60 });

  return {
    boss,
    trialJobs,
    async enqueueTrial(trialId: number) {
      const data: TrialJobData = { trialId };
      // The options go with each job as well, so a queue created earlier with other defaults
      // does not decide them.
      const id = await boss.send(TRIAL_JOB, data, jobOptions);
      if (id === null) throw new Error(`The job queue refused ${TRIAL_JOB} for trial ${trialId}.`);
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true });
    },
  };
}
