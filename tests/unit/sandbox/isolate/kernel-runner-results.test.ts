import { afterEach, describe, expect, it } from 'vitest';
import { exampleKernels } from '@sandbox/kernels/example-catalog.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import {
  args,
  cleanUp,
  expectSoundKernelRuns,
  loadHostile,
  soundLu,
} from '@tests/unit/sandbox/isolate/hostile-helpers.ts';

afterEach(async () => {
  cleanUp();
  await expectSoundKernelRuns();
});

/** A kernel that factors soundly and then returns `expression` built from `f` (the factors). */
const returning = (expression: string, prelude = '') =>
  `${soundLu()}\n${prelude}\nexport function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {\n  const f = sound(a, n);\n  return ${expression};\n}`;

const messageOf = async (source: string, typeCheck: 'block' | 'skip' = 'block') => {
  const out = await (await loadHostile(source, { typeCheck })).call(args());
  return [out.status, out.message];
};

describe('results that try to run code on the host or mislead the checks', () => {
  it('a Proxy whose keys never end is read field by field inside, so it cannot hang the copy', async () => {
    const proxy =
      'new Proxy({} as typeof f, { ownKeys: () => { for (;;) n += 1; }, get: (_t, k) => (k === "lu" ? f.lu : k === "perm" ? f.perm : undefined) })';
    expect(await messageOf(returning(proxy))).toEqual(['ok', undefined]);
  });

  it('a Proxy whose get trap throws is invalid output', async () => {
    const proxy = 'new Proxy(f, { get: () => { throw new Error("trap"); } })';
    expect(await messageOf(returning(proxy))).toEqual([
      'invalid-output',
      'reading the result failed: Error: trap',
    ]);
  });

  it('a getter that never returns times out inside the isolate', async () => {
    const getter = '{ perm: f.perm, get lu(): Float64Array { for (;;) n += 1; } }';
    expect((await messageOf(returning(getter)))[0]).toBe('timeout');
  });

  it('a huge array is refused before it is copied out', async () => {
    expect(await messageOf(returning('{ lu: new Float64Array(1_000_000), perm: f.perm }'))).toEqual(
      [
        'invalid-output',
        'lu must be a Float64Array of length n·n = 16, got Float64Array of length 1000000',
      ],
    );
  });

  it('an async kernel, and a Promise that never settles, are invalid output', async () => {
    const message =
      'factor returned a Promise: kernels must be synchronous (async functions are not supported)';
    const asyncKernel = `${soundLu()}\nexport async function factor(a: Float64Array, n: number) {\n  return sound(a, n);\n}`;
    expect(await messageOf(asyncKernel, 'skip')).toEqual(['invalid-output', message]);
    const never = returning('new Promise(() => undefined) as unknown as typeof f');
    expect(await messageOf(never)).toEqual(['invalid-output', message]);
  });

  it('tampered prototypes and built-ins do not fool the checks', async () => {
    const tamper = `const typed = Object.getPrototypeOf(Int8Array.prototype) as object;
Object.defineProperty(typed, Symbol.toStringTag, { get: () => 'Float64Array' });
Object.defineProperty(typed, 'length', { get: () => 16 });
Object.defineProperty(Array, 'isArray', { value: () => false });
Object.defineProperty(Reflect, 'apply', { value: () => { throw new Error('tampered'); } });
Object.defineProperty(Object, 'getPrototypeOf', { value: () => null });`;
    const plainArray = returning(
      '{ lu: Array.from(f.lu) as unknown as Float64Array, perm: f.perm }',
      tamper,
    );
    expect(await messageOf(plainArray)).toEqual([
      'invalid-output',
      'lu must be a Float64Array of length n·n = 16, got Array',
    ]);
    const fakeLength = returning(
      '{ lu: Object.defineProperty(new Float64Array(2), "length", { get: () => 16 }), perm: f.perm }',
    );
    expect(await messageOf(fakeLength)).toEqual([
      'invalid-output',
      'lu must be a Float64Array of length n·n = 16, got Float64Array of length 2',
    ]);
  });

  it('NaN in the factors is non-finite; a broken perm is invalid output', async () => {
    const [status, message] = await messageOf(
      returning('{ lu: f.lu.fill(NaN, 5, 6), perm: f.perm }'),
    );
    expect([status, (message ?? '').slice(0, 14)]).toEqual(['non-finite', 'lu[1, 1] = NaN']);
    expect(await messageOf(returning('{ lu: f.lu, perm: f.perm.fill(0) }'))).toEqual([
      'invalid-output',
      'perm repeats 0 at positions 0 and 1',
    ]);
  });
});

describe('kernels that look for the host', () => {
  it('process, require, import(), Function and host globals find nothing', async () => {
    const probe = readKernelSource(exampleKernels['lu-host-probe'].file);
    expect(await messageOf(probe)).toEqual(['threw', 'Error: host probe found nothing (n = 4)']);
  });

  it('the clock is the isolate’s own: Date.now works, performance does not exist', async () => {
    const source = `export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {\n  const g = globalThis as unknown as Record<string, unknown>;\n  throw \`\${typeof Date.now()} \${typeof g.performance} \${typeof g.console} \${n}\`;\n}`;
    expect(await messageOf(source)).toEqual(['threw', 'number undefined undefined 4']);
  });
});
