import type { TrialReport } from '@shared/trial-report.ts';

/** The verdict of a trial that ended before any evidence: failed, with the reason as its one rule. */
export function couldNotRunVerdict(message: string): TrialReport['verdict'] {
  return {
    passed: false,
    rules: [
      {
        rule: 'factor-accuracy',
        passed: false,
        offenders: [],
        reason: `The trial could not run: ${message}.`,
      },
    ],
  };
}
