import { spawn } from 'node:child_process';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readResidentMb } from '@sandbox/trial-process/resident-memory.ts';

/** Polls until process `pid` is gone or a zombie (no VmRSS line), up to `limitMs`. */
async function gone(pid: number, limitMs: number): Promise<boolean> {
  const until = Date.now() + limitMs;
  while (Date.now() < until) {
    if (readResidentMb(pid) === null) return true;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return false;
}

describe('the orphan watch of a trial process', () => {
  it('ends the process when its parent dies, even with its main thread blocked', async () => {
    const entry = path.resolve('tests/unit/sandbox/trial-process/orphan-watch-fixture.ts');
    const parent = spawn(process.execPath, ['--import', 'tsx', entry, 'parent'], {
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    const childPid = await new Promise<number>((resolve, reject) => {
      parent.stdout.on('data', (d: Buffer) => resolve(Number(d.toString().trim())));
      parent.on('exit', () => reject(new Error('the parent ended before its child started')));
    });
    try {
      expect(readResidentMb(childPid)).toBeGreaterThan(0);
      parent.kill('SIGKILL');
      // The watch looks every 200 ms here; the limit only ends a test that would otherwise hang.
      expect(await gone(childPid, 10_000)).toBe(true);
    } finally {
      if (readResidentMb(childPid) !== null) process.kill(childPid, 'SIGKILL');
    }
  }, 60_000);
});
