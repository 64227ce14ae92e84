import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleKernels, type ExampleName } from '@sandbox/kernels/example-catalog.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import type { ReferenceMatrix } from '@sandbox/matrices/reference-matrix.ts';
import { namedSet } from '@sandbox/matrices/sets.ts';
import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import { runTrial, type TrialInput, type TrialProgress } from '@sandbox/trial.ts';
import {
  createTrialProcess,
  TrialProcessFault,
  type TrialProcess,
} from '@sandbox/trial-process/trial-process.ts';
import { trialReportSchema } from '@shared/trial-report.ts';

const source = (name: ExampleName) => readKernelSource(exampleKernels[name].file);
const quick = materializeSet(namedSet('quick'), () => '');

/** An LU trial on the first matrices of the quick set, without timing. */
const input = (candidate: ExampleName, extra: Partial<TrialInput> = {}): TrialInput => ({
  routine: 'lu-partial-pivoting',
  candidateSource: source(candidate),
  incumbentSource: source('lu-partial-pivoting-right-looking'),
  setName: 'quick',
  matrices: quick.slice(0, 6),
  timingSizes: [],
  ...extra,
});

/** The report with every measured time set to 0: what two runs of one trial must share. */
function withoutTimes(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutTimes);
  if (typeof value !== 'object' || value === null) return value;
  return Object.fromEntries(
    Object.entries(value).map(([key, v]) => [
      key,
      key === 'ms' || key.endsWith('Ms') ? 0 : key === 'startedAt' ? '' : withoutTimes(v),
    ]),
  );
}

// One trial process for the file, kept warm as the worker keeps it; loading it takes seconds.
describe('trials in a trial process', () => {
  let trials: TrialProcess;
  const pids: number[] = [];

  beforeAll(() => {
    trials = createTrialProcess({
      deadlineMs: 120_000,
      memoryMb: 4096,
      keepWarm: true,
      onSpawn: (pid) => pids.push(pid),
    });
    trials.warm();
  });
  afterAll(() => trials?.close());

  it('reports what runTrial reports in this process, apart from times, with the same progress', async () => {
    const childProgress: TrialProgress[] = [];
    const here: TrialProgress[] = [];
    const inChild = await trials.run({
      ...input('lu-partial-pivoting-right-looking'),
      onProgress: (p) => childProgress.push(p),
    });
    const inProcess = await runTrial({
      ...input('lu-partial-pivoting-right-looking'),
      onProgress: (p) => here.push(p),
    });

    expect(trialReportSchema.safeParse(inChild).success).toBe(true);
    expect(inChild.status).toBe('completed');
    expect(inChild.matrices).toHaveLength(inProcess.matrices.length);
    // Same errors to the last bit: the matrices crossed the channel as the same Float64Arrays.
    expect(withoutTimes(inChild)).toEqual(withoutTimes(inProcess));
    expect(childProgress).toEqual(here);
    expect(childProgress.some((p) => p.phase === 'accuracy' && p.label === quick[0]!.id)).toBe(
      true,
    );
  }, 180_000);

  it('fails a trial whose process is killed from outside, and runs the next in a fresh process', async () => {
    const killedPid = pids.at(-1)!;
    let killed = false;
    const report = await trials.run({
      // Each call of the endless loop lasts its whole call limit: time enough to be killed in.
      ...input('lu-endless-loop', { callTimeoutMs: 20_000 }),
      onProgress: (p) => {
        if (p.phase !== 'accuracy' || killed) return;
        killed = true;
        process.kill(killedPid, 'SIGKILL');
      },
    });
    expect(report.status).toBe('trial-failed');
    expect(report.message).toMatch(
      /^the trial's process was killed by SIGKILL before it reported \(in the accuracy phase, /,
    );
    expect(report.matrices).toEqual([]);
    expect(report.verdict.passed).toBe(false);
    expect(report.verdict.rules[0]!.reason).toContain(report.message);

    const next = await trials.run(input('lu-partial-pivoting-right-looking'));
    expect(next.status).toBe('completed');
    expect(next.verdict.passed).toBe(true);
    expect(pids.at(-1)).not.toBe(killedPid);
  }, 180_000);

  it('rejects as a fault of the harness when runTrial throws in the process, which lives on', async () => {
    const pid = pids.at(-1);
    // Not a kernel's doing: runTrial cannot read a missing matrix list.
    const broken = input('lu-partial-pivoting-right-looking', {
      matrices: undefined as unknown as ReferenceMatrix[],
    });
    await expect(trials.run(broken)).rejects.toThrow(TrialProcessFault);
    await expect(trials.run(broken)).rejects.toThrow(/^the trial threw in its process: /);
    expect((await trials.run(input('lu-partial-pivoting-right-looking'))).status).toBe('completed');
    expect(pids.at(-1)).toBe(pid);
  }, 180_000);

  it('rejects a trial in hand when the process is closed (the worker stopping)', async () => {
    let closing: Promise<void> | null = null;
    const run = trials.run({
      ...input('lu-endless-loop', { callTimeoutMs: 20_000 }),
      onProgress: (p) => {
        if (p.phase === 'accuracy') closing ??= trials.close();
      },
    });
    await expect(run).rejects.toThrow(/closed during the trial/);
    await closing;
    await expect(trials.run(input('lu-partial-pivoting-right-looking'))).rejects.toThrow(/closed/);
  }, 180_000);
});

describe('a trial process that cannot start', () => {
  it('rejects as a fault of the harness, with what the process said', async () => {
    const trials = createTrialProcess({
      deadlineMs: 60_000,
      memoryMb: 512,
      entry: {
        modulePath: 'sandbox/trial-process/no-such-entry.ts',
        execArgv: ['--import', 'tsx'],
        cwd: process.cwd(),
      },
    });
    try {
      await expect(trials.run(input('lu-partial-pivoting-right-looking'))).rejects.toThrow(
        /^the trial process ended before the trial began \(code 1\): .*no-such-entry/s,
      );
    } finally {
      await trials.close();
    }
  }, 60_000);
});
