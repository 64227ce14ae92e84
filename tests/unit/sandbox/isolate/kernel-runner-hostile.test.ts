import { afterEach, describe, expect, it } from 'vitest';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { exampleKernels } from '@sandbox/kernels/example-catalog.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import {
  args,
  cleanUp,
  expectSoundKernelRuns,
  hostileLimits,
  loadHostile,
  soundLu,
} from '@tests/unit/sandbox/isolate/hostile-helpers.ts';

const example = (name: keyof typeof exampleKernels) => readKernelSource(exampleKernels[name].file);

/** Loads a hostile kernel and makes one call on the default 4×4 input. */
const callOnce = async (source: string) => (await loadHostile(source)).call(args());

afterEach(async () => {
  cleanUp();
  await expectSoundKernelRuns();
});

describe('kernels that never finish or take too much', () => {
  it('an endless loop in the kernel times out, and the next call gets a fresh isolate', async () => {
    const kernel = await loadHostile(example('lu-endless-loop'));
    const first = await kernel.call(args());
    expect([first.status, first.message]).toEqual([
      'timeout',
      'The kernel ran longer than the 300 ms limit and was stopped.',
    ]);
    const timed = await kernel.time(args());
    expect(timed).toMatchObject({ ok: false, status: 'timeout' });
    expect(kernel.isolatesStarted).toBe(2);
  });

  it('an endless loop at the module top level stops the load', async () => {
    const source = `let spins = 0;\nwhile (spins >= 0) spins += 1;\n${soundLu().replace('function sound(', 'export function factor(')}`;
    const out = await loadKernel({ source, routine: 'lu-partial-pivoting', limits: hostileLimits });
    expect(out.ok || [out.stage, out.status, out.message]).toEqual([
      'load',
      'timeout',
      "The kernel's module top level ran longer than the 300 ms limit and was stopped.",
    ]);
  });

  it('a typed-array memory hog is out of memory', async () => {
    const kernel = await loadHostile(example('lu-memory-hog'), {
      limits: { ...hostileLimits, callTimeoutMs: 5000 },
    });
    const out = await kernel.call(args());
    expect([out.status, out.message]).toEqual([
      'out-of-memory',
      "The kernel went over the isolate's 32 MB memory limit.",
    ]);
  });

  it('a heap hog disposes its isolate; the next call on the same instance runs in a fresh one', async () => {
    const source = `${soundLu()}
export function factor(a: Float64Array, n: number) {
  const keep: number[][] = [];
  while (n === 3 && keep.length >= 0) keep.push(new Array<number>(1 << 20).fill(n + 0.5));
  return sound(a, n);
}`;
    // A longer call limit than the other cases: on a crowded machine filling the heap can take
    // longer than 300 ms, and the case is about running out of memory, not time.
    const kernel = await loadHostile(source, { limits: { ...hostileLimits, callTimeoutMs: 5000 } });
    const hog = await kernel.call(args(3));
    expect(hog.status).toBe('out-of-memory');
    const next = await kernel.call(args(4));
    expect(next.status).toBe('ok');
    expect(kernel.isolatesStarted).toBe(2);
  });

  it('deep recursion is a thrown RangeError', async () => {
    const source = `function depth(k: number): number {\n  return depth(k + 1) + 1;\n}\nexport function factor(a: Float64Array, n: number) {\n  return { lu: a, perm: new Int32Array(depth(n)) };\n}`;
    const out = await callOnce(source);
    expect([out.status, out.message]).toEqual([
      'threw',
      'RangeError: Maximum call stack size exceeded',
    ]);
  });
});

describe('what a kernel throws', () => {
  const thrower = (what: string) =>
    `export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {\n  if (n > 0) throw ${what};\n  return { lu: a, perm: new Int32Array(n) };\n}`;

  it('a string comes back as it is', async () => {
    const out = await callOnce(thrower("'pivot 3 is zero'"));
    expect([out.status, out.message]).toEqual(['threw', 'pivot 3 is zero']);
  });

  it('an Error comes back as name and message', async () => {
    const out = await callOnce(thrower("new RangeError('not positive definite at column 2')"));
    expect(out.message).toBe('RangeError: not positive definite at column 2');
  });

  it('an object whose toString never returns times out inside the isolate', async () => {
    const out = await callOnce(thrower('{ toString: (): string => { for (;;) n += 1; } }'));
    expect(out.status).toBe('timeout');
  });

  it('an object whose toString throws is described, not trusted', async () => {
    const out = await callOnce(thrower("{ toString: (): string => { throw new Error('no'); } }"));
    expect([out.status, out.message]).toEqual([
      'threw',
      'a thrown value that cannot be turned into text',
    ]);
  });

  it('a huge message is cut to 500 characters', async () => {
    const out = await callOnce(thrower("{ toString: () => 'x'.repeat(1e6) }"));
    expect(out.status).toBe('threw');
    expect(out.message).toBe(`${'x'.repeat(500)}…`);
  });
});
