import type { TrialReport } from '@shared/trial-report.ts';
import { machineFingerprint } from '../timing/machine.ts';
import type { TrialInputData } from './trial-messages.ts';
import { couldNotRunVerdict } from '../trial/could-not-run-verdict.ts';

/**
 * The report of a trial whose process had to be stopped, or died, before it reported: the
 * trial failed (product.md: the trial itself could not run), with `message` saying why, in the
 * same shape as the engine's own failed reports so that it is recorded once like any other.
 * Nothing of the per-matrix results survives the process, so the report has none.
 */
export function stoppedTrialReport(
  input: Pick<TrialInputData, 'routine' | 'setName' | 'matricesMs'>,
  startedAt: Date,
  elapsedMs: number,
  message: string,
): TrialReport {
  return {
    routine: input.routine,
    set: input.setName,
    machine: machineFingerprint(),
    startedAt: startedAt.toISOString(),
    status: 'trial-failed',
    message,
    phases: {
      compileMs: 0,
      matricesMs: input.matricesMs ?? 0,
      kernelMs: 0,
      referenceMs: 0,
      metricsMs: 0,
      timingMs: 0,
      totalMs: elapsedMs,
    },
    diagnostics: { candidate: [], incumbent: [] },
    matrices: [],
    timing: [],
    verdict: couldNotRunVerdict(message),
  };
}
