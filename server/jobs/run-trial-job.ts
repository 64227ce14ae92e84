import type { Logger } from 'pino';
import type { TrialStatus } from '@shared/states.ts';
import type { TrialReport } from '@shared/trial-report.ts';
import { runTrial, type TrialInput } from '@sandbox/trial.ts';
import { createProgressWriter } from './progress-writer.ts';
import { TrialCannotRun } from './trial-cannot-run.ts';
import { finishTrial, type TrialFinishDeps } from './trial-finish.ts';
import { loadTrialInput } from './trial-inputs.ts';
import { startAttempt, writeTrialProgress } from './trial-job.repo.ts';

/** The limits a trial's kernels run under (TRIAL_* in config/env.ts). */
export interface TrialLimits {
  callTimeoutMs: number;
  memoryLimitMb: number;
  timingBudgetMs?: number | undefined;
}

/**
 * Runs the engine on one trial's input. The worker process runs each trial in its trial process
 * (sandbox/trial-process/trial-process.ts), which can kill a kernel that no limit of its isolate
 * stops; in-process runTrial, the default, serves tests and the demo loader.
 */
export type TrialRunner = (input: TrialInput) => Promise<TrialReport>;

export interface TrialJobDeps extends TrialFinishDeps {
  limits: TrialLimits;
  runTrial?: TrialRunner;
  logger: Pick<Logger, 'info' | 'warn' | 'error'>;
  progressIntervalMs?: number;
}

/** What one job did; pg-boss stores it as the job's output. */
export interface TrialJobResult {
  trialId: number;
  /** The status written, or why nothing was written. */
  outcome: TrialStatus | 'missing' | 'already-finished' | 'superseded';
  attempt?: number;
}

/**
 * Runs one `trial.run` job: starts a try (running, attempts + 1, stale results deleted), loads
 * the trial's inputs, runs the engine with progress written as it goes, and ends the trial in
 * one transaction. A finished trial is skipped, so redelivery is harmless. Inputs that cannot
 * be assembled end the trial as trial-failed at once, and so does a trial its trial process had
 * to stop (the runner reports it as trial-failed, the kernel's fault, written once). Anything
 * else that throws (the database, a fault of the harness) fails the job, and pg-boss tries
 * again; the next try starts afresh.
 */
export async function runTrialJob(deps: TrialJobDeps, trialId: number): Promise<TrialJobResult> {
  const start = await startAttempt(deps.db, trialId);
  if (start.kind !== 'started') {
    deps.logger.info({ trialId, outcome: start.kind }, 'trial job skipped');
    return { trialId, outcome: start.kind };
  }
  const { trial, attempt } = start;
  deps.logger.info({ trialId, attempt }, 'trial started');

  let input;
  try {
    input = await loadTrialInput(deps.db, trial);
  } catch (err) {
    if (!(err instanceof TrialCannotRun)) throw err;
    const written = await finishTrial(deps, trialId, attempt, {
      kind: 'cannot-run',
      message: err.message,
    });
    return { trialId, attempt, outcome: written ? 'trial-failed' : 'superseded' };
  }

  const progress = createProgressWriter(
    (p) => writeTrialProgress(deps.db, trialId, attempt, p),
    (err) => deps.logger.warn({ err, trialId }, 'could not write trial progress'),
    deps.progressIntervalMs,
  );
  let report;
  try {
    report = await (deps.runTrial ?? runTrial)({
      ...input,
      callTimeoutMs: deps.limits.callTimeoutMs,
      memoryLimitMb: deps.limits.memoryLimitMb,
      ...(deps.limits.timingBudgetMs !== undefined
        ? { timingBudgetMs: deps.limits.timingBudgetMs }
        : {}),
      onProgress: (p) => progress.update(p),
    });
  } finally {
    await progress.close();
  }
  const written = await finishTrial(deps, trialId, attempt, { kind: 'report', report });
  deps.logger.info({ trialId, attempt, status: report.status, written }, 'trial finished');
  return { trialId, attempt, outcome: written ? report.status : 'superseded' };
}
