import type { TrialReport } from '@shared/trial-report.ts';
import type { trials } from '@server/db/schema/trials.ts';

export type TrialRow = typeof trials.$inferSelect;

/** How a trial ended, as the final transaction records it. */
export type TrialEnd =
  /** The engine ran and reported: completed, or trial-failed when the kernel could not run. */
  | { kind: 'report'; report: TrialReport }
  /** The trial's inputs could not be assembled (a bad matrix set item, an unreadable upload). */
  | { kind: 'cannot-run'; message: string }
  /** The harness failed on every try (pg-boss gave up); nothing is known about the kernel. */
  | { kind: 'errored'; message: string };

export type FinishedStatus = 'completed' | 'trial-failed' | 'errored';

/** A trial in the final transaction, after its row was updated; handed to the follow-ups. */
export interface FinishedTrial {
  trial: TrialRow;
  status: FinishedStatus;
  report: TrialReport | null;
  message: string | null;
}

export function finishedStatus(end: TrialEnd): FinishedStatus {
  if (end.kind === 'report') return end.report.status;
  return end.kind === 'cannot-run' ? 'trial-failed' : 'errored';
}
