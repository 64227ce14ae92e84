import type { TrialReport } from '@shared/trial-report.ts';
import type { TrialInput } from '../trial.ts';
import { createTrialProcess, type TrialProcessOptions } from './trial-process.ts';

/**
 * One trial in a process of its own, which ends with it: for a single trial (the command-line
 * evaluator, tests). A worker keeps one process across trials instead (createTrialProcess).
 */
export async function runTrialInChild(
  input: TrialInput,
  options: TrialProcessOptions,
): Promise<TrialReport> {
  const trialProcess = createTrialProcess(options);
  try {
    return await trialProcess.run(input);
  } finally {
    await trialProcess.close();
  }
}
