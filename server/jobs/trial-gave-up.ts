import type { Logger } from 'pino';
import { finishTrial, type TrialFinishDeps } from './trial-finish.ts';

/** What pg-boss stored as the last failure of a job, reduced to a line for the log. */
export function lastFailure(output: unknown): string {
  if (output && typeof output === 'object') {
    const o = output as { message?: unknown; value?: unknown };
    if (typeof o.message === 'string') return o.message;
    if (typeof o.value === 'string') return o.value;
    if (o.value && typeof o.value === 'object') return lastFailure(o.value);
  }
  return 'unknown';
}

/**
 * Handles a `trial.run` job that pg-boss gave up on (its dead letter): every try failed in the
 * harness, or the worker running it died each time. The trial becomes `errored`, its candidate
 * trial-failed (so a new revision can be submitted), a drift check `failed`. The team sees a
 * message without internals (errors from the database carry SQL); the log has the cause.
 */
export async function markTrialGaveUp(
  deps: TrialFinishDeps & { logger: Pick<Logger, 'error'> },
  trialId: number,
  output: unknown,
): Promise<boolean> {
  const cause = lastFailure(output);
  deps.logger.error({ trialId, cause }, 'trial gave up after its last try');
  const byTimeout = cause.includes('timeout') || cause.includes('shut down');
  const message = byTimeout
    ? 'The trial was stopped on every try (its worker stopped or ran out of time): a fault of the service, not of the kernel.'
    : 'The trial failed on every try with an internal error: a fault of the service, not of the kernel. The operators have the details.';
  return finishTrial(deps, trialId, null, { kind: 'errored', message });
}
