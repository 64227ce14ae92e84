import type { TrialProgress } from '../trial.ts';

/** Why a trial process that was not stopped on purpose ended without a report. */
export function deathMessage(
  code: number | null,
  signal: NodeJS.Signals | null,
  stderrTail: string,
  memoryMb: number,
): string {
  // V8's own words when a heap reaches --max-old-space-size (the process then aborts).
  if (/heap out of memory|Reached heap limit/i.test(stderrTail)) {
    return `the trial's process ran out of memory (its heap is limited to ${memoryMb} MB)`;
  }
  if (signal) return `the trial's process was killed by ${signal} before it reported`;
  return `the trial's process exited with code ${code} before it reported`;
}

/** Where a trial stood, from its last progress: " (in the accuracy phase, hilbert-n8, 2 of 9 done)". */
export function whereItStood(progress: TrialProgress | null): string {
  if (!progress) return '';
  const label = progress.label ? `, ${progress.label}` : '';
  return ` (in the ${progress.phase} phase${label}, ${progress.done} of ${progress.total} done)`;
}
