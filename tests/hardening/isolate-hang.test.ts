import { spawn } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

/** Runs isolate-hang-probe.ts in a child process, killed with SIGKILL after `deadlineMs`. */
function runProbe(deadlineMs: number): Promise<{ stdout: string; killed: boolean }> {
  const entry = path.resolve('tests/hardening/isolate-hang-probe.ts');
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ['--no-node-snapshot', '--no-concurrent-recompilation', '--import', 'tsx', entry],
      { stdio: ['ignore', 'pipe', 'ignore'] },
    );
    let stdout = '';
    let killed = false;
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
    const timer = setTimeout(() => {
      killed = true;
      child.kill('SIGKILL');
    }, deadlineMs);
    child.on('error', reject);
    child.on('close', () => {
      clearTimeout(timer);
      resolve({ stdout, killed });
    });
  });
}

describe('a heap hog that isolated-vm cannot stop', () => {
  // KNOWN FAULT, not yet fixed: closures chained over 2 MB arrays drive the isolate to its heap
  // limit in a way that neither the call timeout nor Isolate.dispose() ends (isolated-vm 5.0.4,
  // Node 20): the isolate's thread spins and the call never settles, so only killing the process
  // stops it. The worker copes by ending itself when the trial outlives its job's expiry
  // (server/jobs/one-trial-at-a-time.ts), and npm start starts a fresh one; the job's retries and
  // then its dead letter record the trial. `it.fails` keeps the suite green while the engine's
  // fault stands; when a fix lands (a call deadline that can stop the isolate's thread, say) this
  // test fails: turn it into `it`.
  it.fails(
    'ends the call with a status within 20 s',
    async () => {
      const { stdout, killed } = await runProbe(20_000);
      expect(killed).toBe(false);
      expect(JSON.parse(stdout)).toMatchObject({
        status: expect.stringMatching(/out-of-memory|timeout/),
      });
    },
    30_000,
  );
});
