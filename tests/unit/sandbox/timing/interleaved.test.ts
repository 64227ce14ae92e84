import { describe, expect, it } from 'vitest';
import { flopCount } from '@sandbox/timing/flops.ts';
import { runInterleavedTiming, type TimingProgress } from '@sandbox/timing/interleaved.ts';
import type { TimedCall, TimedKernel } from '@sandbox/timing/timed-kernel.ts';
import { seededNormal } from '@tests/helpers/seeded-random.ts';

/** A fake input: which size and which makeInput call produced it. */
interface FakeInput {
  n: number;
  serial: number;
}

interface LoggedCall {
  kernel: string;
  input: FakeInput;
}

/** A fake kernel that records its calls in a shared log and answers from a script (no real timing). */
function fakeKernel(
  name: string,
  log: LoggedCall[],
  script: (call: number, input: FakeInput) => TimedCall,
): TimedKernel<FakeInput> {
  let calls = 0;
  return {
    time(input) {
      log.push({ kernel: name, input });
      return Promise.resolve(script(calls++, input));
    },
  };
}

function inputMaker() {
  let serial = 0;
  return (n: number): FakeInput => ({ n, serial: serial++ });
}

const constant = (ms: number) => (): TimedCall => ({ ok: true, ms });

describe('runInterleavedTiming: call order and warm-up', () => {
  it('warms up, then alternates the order round by round, on a fresh input per call', async () => {
    const log: LoggedCall[] = [];
    const results = await runInterleavedTiming({
      sizes: [4],
      routine: 'cholesky',
      candidate: fakeKernel('C', log, constant(1)),
      incumbent: fakeKernel('I', log, constant(1)),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 3,
      minRounds: 5,
      maxRounds: 5,
    });
    // 3 warm-up passes and 5 rounds; candidate first on even (0-based) passes.
    const order = log.map((c) => c.kernel).join('');
    expect(order).toBe('CI' + 'IC' + 'CI' + 'CI' + 'IC' + 'CI' + 'IC' + 'CI');
    expect(results[0]!.rounds).toBe(5);
    expect(new Set(log.map((c) => c.input)).size).toBe(log.length); // never the same object twice
    expect(log.every((c) => c.input.n === 4)).toBe(true);
  });

  it('chooses the warm-up count from the first call when none is given', async () => {
    const log: LoggedCall[] = [];
    // A first call of 50 ms → ⌈100/50⌉ = 2 → raised to the minimum of 5 warm-up calls.
    await runInterleavedTiming({
      sizes: [8],
      routine: 'ldlt',
      candidate: fakeKernel('C', log, (k) => ({ ok: true, ms: k === 0 ? 50 : 2 })),
      makeInput: inputMaker(),
      budgetMs: 0,
      minRounds: 11,
      maxRounds: 11,
    });
    expect(log.length).toBe(5 + 11);
  });

  it('chooses rounds per size from the budget and the last warm-up times', async () => {
    const log: LoggedCall[] = [];
    const results = await runInterleavedTiming({
      sizes: [2, 3],
      routine: 'lu-partial-pivoting',
      candidate: fakeKernel('C', log, constant(1)),
      incumbent: fakeKernel('I', log, constant(1)),
      makeInput: inputMaker(),
      budgetMs: 60, // per size; 2 ms per round → 30 rounds each
      warmup: 2,
    });
    expect(results.map((r) => r.rounds)).toEqual([30, 30]);
    expect(log.filter((c) => c.input.n === 3 && c.kernel === 'I').length).toBe(2 + 30);
  });
});

describe('runInterleavedTiming: results', () => {
  it('finds a planted 20 % slowdown and reports GFLOP/s at the median time', async () => {
    const z = seededNormal(99);
    const results = await runInterleavedTiming({
      sizes: [16],
      routine: 'lu-partial-pivoting',
      candidate: fakeKernel('C', [], () => ({ ok: true, ms: 1.2 * Math.exp(0.02 * z()) })),
      incumbent: fakeKernel('I', [], () => ({ ok: true, ms: Math.exp(0.02 * z()) })),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 2,
      minRounds: 31,
      maxRounds: 31,
    });
    const size = results[0]!;
    expect(size.verdict).toBe('slower');
    expect(size.ci95![0]).toBeGreaterThan(1);
    expect(size.flags).toEqual([]);
    const expectedGflops =
      flopCount('lu-partial-pivoting', 16, 16) / (size.candidate!.medianMs * 1e6);
    expect(size.candidate!.gflops).toBeCloseTo(expectedGflops, 12);
  });

  it('times the candidate alone when there is no incumbent', async () => {
    const log: LoggedCall[] = [];
    const [size] = await runInterleavedTiming({
      sizes: [5],
      routine: 'householder-qr',
      rows: (n) => 2 * n,
      candidate: fakeKernel('C', log, constant(0.5)),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 1,
    });
    expect(log.every((c) => c.kernel === 'C')).toBe(true);
    expect(size).toMatchObject({
      incumbent: null,
      ratio: null,
      ci95: null,
      verdict: null,
      rounds: 11,
    });
    expect(size!.candidate!.gflops).toBeCloseTo(flopCount('householder-qr', 10, 5) / 0.5e6, 12);
  });

  it('flags a kernel stuck slow after a fast warm-up', async () => {
    const [size] = await runInterleavedTiming({
      sizes: [6],
      routine: 'cholesky',
      candidate: fakeKernel('C', [], (k) => ({ ok: true, ms: k < 4 ? 1 : 1.8 })),
      incumbent: fakeKernel('I', [], constant(1)),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 4,
    });
    expect(size!.flags).toEqual(['candidate-stuck-slow']);
  });

  it('stops a size at a failed call, reports it, and goes on with the next size', async () => {
    const log: LoggedCall[] = [];
    const candidate = fakeKernel('C', log, (k, input) =>
      input.n === 7 && k === 5
        ? { ok: false, status: 'timeout', message: 'over 2 s' }
        : { ok: true, ms: 1 },
    );
    const results = await runInterleavedTiming({
      sizes: [7, 9],
      routine: 'cholesky',
      candidate,
      incumbent: fakeKernel('I', log, constant(1)),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 2,
    });
    // Candidate calls 0, 1 are warm-up, 2, 3, 4 rounds 0–2; call 5 (round 3) fails.
    expect(results[0]).toMatchObject({
      rounds: 3,
      verdict: null,
      ratio: null,
      flags: ['candidate-failed'],
      failure: { kernel: 'candidate', phase: 'timing', status: 'timeout', message: 'over 2 s' },
    });
    expect(results[1]).toMatchObject({
      n: 9,
      rounds: 11,
      failure: null,
      verdict: 'no clear difference',
    });
  });

  it('reports progress: warm-up, each round, done', async () => {
    const events: TimingProgress[] = [];
    await runInterleavedTiming({
      sizes: [3],
      routine: 'back-substitution',
      candidate: fakeKernel('C', [], constant(1)),
      makeInput: inputMaker(),
      budgetMs: 0,
      warmup: 1,
      onProgress: (p) => events.push(p),
    });
    expect(events.map((e) => e.phase)).toEqual(['warm-up', ...Array(11).fill('timing'), 'done']);
    expect(events.at(-1)).toMatchObject({
      sizeIndex: 0,
      sizeCount: 1,
      n: 3,
      round: 11,
      rounds: 11,
    });
  });

  it('rejects bad options before timing anything', async () => {
    const log: LoggedCall[] = [];
    const base = {
      sizes: [3],
      routine: 'cholesky' as const,
      candidate: fakeKernel('C', log, constant(1)),
      makeInput: inputMaker(),
      budgetMs: 10,
    };
    await expect(runInterleavedTiming({ ...base, sizes: [] })).rejects.toThrow(/sizes/);
    await expect(runInterleavedTiming({ ...base, warmup: 0 })).rejects.toThrow(/warmup/);
    await expect(runInterleavedTiming({ ...base, margin: -1 })).rejects.toThrow(/margin/);
    await expect(runInterleavedTiming({ ...base, budgetMs: NaN })).rejects.toThrow(/budgetMs/);
    expect(log).toEqual([]);
    const zero = fakeKernel('Z', [], constant(0));
    await expect(runInterleavedTiming({ ...base, candidate: zero })).rejects.toThrow(/positive/);
  });
});
