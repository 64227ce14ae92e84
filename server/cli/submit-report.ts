import type { Submission } from '@shared/api/candidates.ts';
import type { TrialDetail, TrialEvent } from '@shared/api/trials.ts';

/** What the progress lines count in each phase. */
const phaseUnits: Record<TrialEvent['progress']['phase'], string> = {
  queued: '',
  compile: 'kernels',
  accuracy: 'matrices',
  timing: 'steps',
  verdict: '',
  done: '',
};

/** The type check's findings, one line each, as `file:line:column code message`. */
export function formatDiagnostics(kernelPath: string, submission: Submission): string[] {
  const { revision } = submission;
  if (revision.diagnostics.length === 0) return ['type check: no problems'];
  return [
    `type check: ${revision.errorCount} error${revision.errorCount === 1 ? '' : 's'}`,
    ...revision.diagnostics.map((d) => {
      const where = d.file === 'kernel' ? kernelPath : 'contract';
      return `  ${where}:${d.line}:${d.column} ${d.code} ${d.message}`;
    }),
  ];
}

/** One line for a change of status or progress, e.g. `accuracy: 3/12 matrices (hilbert-n6)`. */
export function formatProgress(event: TrialEvent): string {
  const { status, progress } = event;
  if (status === 'queued') return 'queued: waiting for a worker';
  if (status !== 'running') return `${status}${event.message ? `: ${event.message}` : ''}`;
  const unit = phaseUnits[progress.phase];
  const count =
    progress.total > 0 ? `: ${progress.done}/${progress.total}${unit ? ` ${unit}` : ''}` : '';
  return `${progress.phase}${count}${progress.label ? ` (${progress.label})` : ''}`;
}

/** The outcome: the policy verdict rule by rule, or why the trial did not complete. */
export function formatVerdict(trial: TrialDetail): string[] {
  if (trial.status !== 'completed' || !trial.verdict) {
    const what = trial.status === 'errored' ? 'errored (a fault of the service)' : trial.status;
    return [`trial ${trial.id} ${what}: ${trial.message ?? 'no reason given'}`];
  }
  const lines = [`verdict: ${trial.verdict.passed ? 'PASSED' : 'FAILED'}`];
  for (const rule of trial.verdict.rules) {
    // The reason often names the offenders already; list them only when it does not.
    const unnamed = rule.offenders.filter((o) => !rule.reason.includes(o));
    const offenders = unnamed.length > 0 ? ` [${unnamed.join(', ')}]` : '';
    lines.push(`  ${rule.passed ? 'pass' : 'FAIL'}  ${rule.rule}: ${rule.reason}${offenders}`);
  }
  return lines;
}

/**
 * Where people read the trial and the candidate: the client's pages, whose paths must match
 * client/app/paths.ts (`trial` and `candidate`).
 */
export function formatLinks(
  serverUrl: string,
  teamSlug: string,
  submission: Submission,
  trialId: number | null,
): string[] {
  const team = `${serverUrl}/teams/${encodeURIComponent(teamSlug)}`;
  return [
    ...(trialId === null ? [] : [`trial:     ${team}/trials/${trialId}`]),
    `candidate: ${team}/candidates/${submission.candidate.id}`,
  ];
}
