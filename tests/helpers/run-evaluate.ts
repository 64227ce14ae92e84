import { spawn } from 'node:child_process';
import path from 'node:path';
import { parseWithNonFinite } from '@shared/json-numbers.ts';
import { trialReportSchema, type TrialReport } from '@shared/trial-report.ts';

export interface EvaluateRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

/**
 * Runs the command-line evaluator exactly as `npm run evaluate` does (same Node flags, same
 * entry), without npm in between, and collects its output.
 */
export function runEvaluate(args: string[], timeoutMs = 120_000): Promise<EvaluateRun> {
  const entry = path.resolve('sandbox/cli/evaluate.ts');
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ['--no-node-snapshot', '--no-concurrent-recompilation', '--import', 'tsx', entry, ...args],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.on('error', reject);
    child.on('close', (code) => {
      clearTimeout(timer);
      resolve({ code, stdout, stderr });
    });
  });
}

/** Parses and validates the evaluator's `--json` document. */
export function parseReport(stdout: string): TrialReport {
  return trialReportSchema.parse(parseWithNonFinite(stdout));
}
