/**
 * What the web process needs of the job queue: put a trial (or a drift check) on it. The
 * pg-boss implementation lives beside this file (jobs/pg-boss-queue.ts); tests may pass it too.
 */
export interface TrialQueue {
  /** Queues job `trial.run` for an existing trials row (status queued). */
  enqueueTrial(trialId: number): Promise<void>;
  stop(): Promise<void>;
}

export const TRIAL_JOB = 'trial.run';
export const DRIFT_JOB = 'drift.check';
