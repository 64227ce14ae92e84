import { describe, expect, it } from 'vitest';
import { flopCount } from '@sandbox/timing/flops.ts';
import { runInterleavedTiming, type TimingProgress } from '@sandbox/timing/interleaved.ts';
import { DEFAULT_BLOCKS } from '@sandbox/timing/rounds.ts';
import type { FreshKernels, TimedCall, TimedKernel } from '@sandbox/timing/timed-kernel.ts';
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
      blocks: 1,
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
      blocks: 1,
      budgetMs: 0,
      minRounds: 11,
      maxRounds: 11,
    });
    expect(log.length).toBe(5 + 11);
  });

  it('chooses rounds per block and size from the budget and the last warm-up times', async () => {
    const log: LoggedCall[] = [];
    const results = await runInterleavedTiming({
      sizes: [2, 3],
      routine: 'lu-partial-pivoting',
      candidate: fakeKernel('C', log, constant(1)),
      incumbent: fakeKernel('I', log, constant(1)),
      makeInput: inputMaker(),
      blocks: 2,
      budgetMs: 60, // per size, 30 per block; 2 ms per round → 15 rounds per block
      warmup: 2,
    });
    expect(results.map((r) => r.rounds)).toEqual([30, 30]);
    expect(results.map((r) => r.roundsPerBlock)).toEqual([
      [15, 15],
      [15, 15],
    ]);
    expect(log.filter((c) => c.input.n === 3 && c.kernel === 'I').length).toBe(2 * (2 + 15));
    // Every call took 1 ms: the time inside calls counts warm-up and rounds of both kernels.
    for (const [i, n] of [2, 3].entries()) {
      expect(results[i]!.callMs).toBe(log.filter((c) => c.input.n === n).length);
    }
    expect(results[1]!.callMs).toBe(2 * 2 * (2 + 15));
  });
  it('plans rounds from the fastest warm-up calls, so one delayed call does not cut them', async () => {
    // Candidate warm-up calls 30 ms (first), 1 ms, 9 ms (delayed); incumbent 1 ms each. A round
    // costs 1 + 1 = 2 ms, so a budget of 20 ms buys 10 rounds (the last call would give 2).
    const [size] = await runInterleavedTiming({
      sizes: [4],
      routine: 'cholesky',
      candidate: fakeKernel('C', [], (k) => ({ ok: true, ms: [30, 1, 9][k] ?? 1 })),
      incumbent: fakeKernel('I', [], constant(1)),
      makeInput: inputMaker(),
      blocks: 1,
      budgetMs: 20,
      warmup: 3,
    });
    expect(size!.rounds).toBe(10);
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
    // Budget 0: the minimum of one round in each of the default blocks.
    expect(size).toMatchObject({
      incumbent: null,
      ratio: null,
      ci95: null,
      verdict: null,
      rounds: DEFAULT_BLOCKS,
      blocks: DEFAULT_BLOCKS,
      blockRatios: [],
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
      blocks: 1,
      budgetMs: 0,
      warmup: 4,
      minRounds: 11,
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
      blocks: 1,
      budgetMs: 0,
      warmup: 2,
      minRounds: 11,
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
      blocks: 1,
      budgetMs: 0,
      warmup: 1,
      minRounds: 11,
      onProgress: (p) => events.push(p),
    });
    expect(events.map((e) => e.phase)).toEqual(['warm-up', ...Array(11).fill('timing'), 'done']);
    expect(events.at(-1)).toMatchObject({
      block: 0,
      blockCount: 1,
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
    await expect(runInterleavedTiming({ ...base, blocks: 0 })).rejects.toThrow(/blocks/);
    await expect(runInterleavedTiming({ ...base, margin: -1 })).rejects.toThrow(/margin/);
    await expect(runInterleavedTiming({ ...base, budgetMs: NaN })).rejects.toThrow(/budgetMs/);
    expect(log).toEqual([]);
    const zero = fakeKernel('Z', [], constant(0));
    await expect(runInterleavedTiming({ ...base, candidate: zero })).rejects.toThrow(/positive/);
  });
});

/** Fresh fake kernels: each fresh() is a new "isolate" that logs its calls under its own name. */
function freshFakes(
  side: string,
  events: string[],
  log: LoggedCall[],
  script: (isolate: number, call: number, input: FakeInput) => TimedCall,
  failToStart: (isolate: number) => boolean = () => false,
): FreshKernels<FakeInput> {
  let started = 0;
  return {
    fresh() {
      const isolate = started++;
      if (failToStart(isolate)) {
        events.push(`fail ${side}${isolate}`);
        return Promise.resolve({ ok: false, status: 'out-of-memory', message: 'no room' });
      }
      events.push(`open ${side}${isolate}`);
      const kernel = fakeKernel(`${side}${isolate}`, log, (call, input) =>
        script(isolate, call, input),
      );
      return Promise.resolve({
        ok: true,
        kernel: { ...kernel, dispose: () => events.push(`dispose ${side}${isolate}`) },
      });
    },
  };
}

describe('runInterleavedTiming: blocks of fresh kernels', () => {
  it('opens a fresh pair per block in alternating order, times every size in it, disposes it', async () => {
    const events: string[] = [];
    const log: LoggedCall[] = [];
    const results = await runInterleavedTiming({
      sizes: [4, 8],
      routine: 'lu-partial-pivoting',
      candidate: freshFakes('C', events, log, () => ({ ok: true, ms: 1 })),
      incumbent: freshFakes('I', events, log, () => ({ ok: true, ms: 1 })),
      makeInput: inputMaker(),
      blocks: 3,
      budgetMs: 0,
      warmup: 1,
      minRounds: 2,
      maxRounds: 2,
    });
    expect(events).toEqual([
      ...['open C0', 'open I0', 'dispose C0', 'dispose I0'],
      ...['open I1', 'open C1', 'dispose I1', 'dispose C1'],
      ...['open C2', 'open I2', 'dispose C2', 'dispose I2'],
    ]);
    // Block b: size 4 then size 8, each one warm-up pass and two rounds; the warm-up pass and
    // round 0 take the order of pass b, round 1 the order of pass b + 1 (candidate first on even).
    const order = (pass: number, b: number) =>
      pass % 2 === 0 ? [`C${b}`, `I${b}`] : [`I${b}`, `C${b}`];
    const expected: string[] = [];
    for (let b = 0; b < 3; b++) {
      for (const n of [4, 8]) {
        for (const pass of [b, b, b + 1]) expected.push(...order(pass, b).map((k) => `${k}:${n}`));
      }
    }
    expect(log.map((c) => `${c.kernel}:${c.input.n}`)).toEqual(expected);
    expect(results.map((r) => [r.blocks, r.rounds, r.roundsPerBlock])).toEqual([
      [3, 6, [2, 2, 2]],
      [3, 6, [2, 2, 2]],
    ]);
  });

  it('warms a fresh isolate fully and an already warm one briefly', async () => {
    const log: LoggedCall[] = [];
    // Every call 4 ms: a fresh isolate gets ⌈100/4⌉ = 25 warm-up calls (chooseWarmup), the
    // second size in the same isolates ⌈20/4⌉ = 5 (chooseWarmupInWarmIsolate).
    await runInterleavedTiming({
      sizes: [4, 8],
      routine: 'cholesky',
      candidate: freshFakes('C', [], log, () => ({ ok: true, ms: 4 })),
      makeInput: inputMaker(),
      blocks: 2,
      budgetMs: 0,
      minRounds: 1,
      maxRounds: 1,
    });
    const count = (name: string, n: number) =>
      log.filter((c) => c.kernel === name && c.input.n === n).length;
    expect([count('C0', 4), count('C0', 8), count('C1', 4), count('C1', 8)]).toEqual([
      25 + 1,
      5 + 1,
      25 + 1,
      5 + 1,
    ]);
  });

  it('reports a failure in a later block for that size only, and times the other size on', async () => {
    const events: string[] = [];
    const log: LoggedCall[] = [];
    const results = await runInterleavedTiming({
      sizes: [5, 7],
      routine: 'cholesky',
      // The candidate's isolate of block 3 times out on its third call at n = 7.
      candidate: freshFakes('C', events, log, (isolate, call, input) =>
        isolate === 3 && input.n === 7 && call === 4
          ? { ok: false, status: 'timeout', message: 'over 10 s' }
          : { ok: true, ms: 1 },
      ),
      incumbent: freshFakes('I', events, log, () => ({ ok: true, ms: 1 })),
      makeInput: inputMaker(),
      blocks: 8,
      budgetMs: 0,
      warmup: 1,
      minRounds: 2,
      maxRounds: 2,
    });
    // Block 3's candidate: calls 0–2 at n = 5 (warm-up, two rounds), 3 warm-up at n = 7, 4 fails.
    expect(results[1]).toMatchObject({
      rounds: 3 * 2,
      blocks: 3,
      verdict: null,
      ratio: null,
      flags: ['candidate-failed'],
      failure: { kernel: 'candidate', phase: 'timing', status: 'timeout', block: 3 },
    });
    expect(results[0]).toMatchObject({ blocks: 8, rounds: 16, failure: null, flags: [] });
    expect(results[0]!.verdict).toBe('no clear difference');
    // No later block times n = 7, and every opened kernel was disposed.
    expect(log.filter((c) => c.kernel === 'C5' && c.input.n === 7)).toEqual([]);
    const opened = events.filter((e) => e.startsWith('open')).map((e) => e.slice(5));
    const disposed = events.filter((e) => e.startsWith('dispose')).map((e) => e.slice(8));
    expect(disposed.sort()).toEqual(opened.sort());
    expect(opened).toHaveLength(16);
  });

  it('reports a fresh kernel that does not start as a failure of every size, not a throw', async () => {
    const events: string[] = [];
    const results = await runInterleavedTiming({
      sizes: [5, 7],
      routine: 'cholesky',
      candidate: freshFakes('C', events, [], () => ({ ok: true, ms: 1 })),
      incumbent: freshFakes(
        'I',
        events,
        [],
        () => ({ ok: true, ms: 1 }),
        (isolate) => isolate === 2,
      ),
      makeInput: inputMaker(),
      blocks: 8,
      budgetMs: 0,
      warmup: 1,
    });
    for (const size of results) {
      expect(size).toMatchObject({
        blocks: 2,
        verdict: null,
        flags: ['incumbent-failed'],
        failure: { kernel: 'incumbent', phase: 'warm-up', status: 'out-of-memory', block: 2 },
      });
    }
    // Block 2 opens the candidate first (even block) and frees it; no block after it starts.
    expect(events.slice(-3)).toEqual(['open C2', 'fail I2', 'dispose C2']);
  });
});
