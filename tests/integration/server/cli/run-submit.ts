import { spawn } from 'node:child_process';
import path from 'node:path';

export interface SubmitRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

/**
 * Runs the submit command exactly as `npm run submit` does (same Node flags, same entry),
 * without npm in between, with only the environment given here (no STABLEHAND_* of the caller).
 */
export function runSubmit(
  args: string[],
  env: Record<string, string>,
  timeoutMs = 120_000,
): Promise<SubmitRun> {
  const entry = path.resolve('server/cli/submit.ts');
  const inherited = Object.fromEntries(
    Object.entries(process.env).filter(([k]) => !k.startsWith('STABLEHAND_')),
  );
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ['--no-node-snapshot', '--no-concurrent-recompilation', '--import', 'tsx', entry, ...args],
      { stdio: ['ignore', 'pipe', 'pipe'], env: { ...inherited, ...env } },
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
