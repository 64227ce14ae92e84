import { describe, expect, it } from 'vitest';
import { routineSlugs } from '@shared/routines.ts';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { starterKernelFiles } from '@sandbox/kernels/starter-kernels.ts';
import { RATIO_THRESHOLD } from '@tests/unit/sandbox/kernels/factor-checks.ts';
import { residualRatios, sampleArgs } from '@tests/unit/sandbox/kernels/routine-checks.ts';

const limits = { callTimeoutMs: 2_000, loadTimeoutMs: 500, memoryMb: 64 };

describe('loadKernel with the starter kernels', () => {
  it.each(routineSlugs)('%s: factors a random matrix with ratios below 30', async (routine) => {
    const loaded = await loadKernel({
      source: readKernelSource(starterKernelFiles[routine]),
      routine,
      limits,
    });
    expect(loaded.ok && loaded.diagnostics).toEqual([]);
    if (!loaded.ok) return;
    const args = sampleArgs(routine, 7, 11);
    const input = Float64Array.from(args.a);
    const out = await loaded.kernel.call(args);
    expect([out.status, out.message]).toEqual(['ok', undefined]);
    // The kernel overwrote only its own copy.
    expect(args.a).toEqual(input);
    // Pass threshold 30: LAPACK TESTING/dtest.in (numerics-references.md §1.2).
    for (const ratio of residualRatios(routine, args, out.result!))
      expect(ratio).toBeLessThan(RATIO_THRESHOLD);
    const timed = await loaded.kernel.time(args, { repeat: 3 });
    expect(timed.ok && timed.ms).toBeGreaterThan(0);
    loaded.kernel.dispose();
  });
});

describe('loadKernel stages', () => {
  const good = readKernelSource(starterKernelFiles['lu-no-pivoting']);

  it('stops at compile for a syntax error', async () => {
    const out = await loadKernel({
      source: 'export function factor(a: Float64Array {',
      routine: 'lu-no-pivoting',
    });
    expect(out.ok || [out.stage, out.diagnostics[0]!.code]).toEqual(['compile', 'syntax']);
  });

  it('stops at type-check by default, and loads with warn', async () => {
    const source = good.replace('n: number)', 'n: string)');
    const blocked = await loadKernel({ source, routine: 'lu-no-pivoting' });
    expect(blocked.ok || [blocked.stage, blocked.diagnostics[0]!.code]).toEqual([
      'type-check',
      'TS2322',
    ]);
    const warned = await loadKernel({
      source,
      routine: 'lu-no-pivoting',
      typeCheck: 'warn',
      limits,
    });
    expect(warned.ok).toBe(true);
    if (!blocked.ok && warned.ok) {
      expect(blocked.diagnostics.length).toBeGreaterThan(0);
      expect(warned.diagnostics).toEqual(blocked.diagnostics);
    }
    if (warned.ok) warned.kernel.dispose();
  });

  it('stops at load when the export is missing and the check was skipped', async () => {
    const source = 'export function factorize(a: Float64Array) { return { lu: a }; }';
    const out = await loadKernel({ source, routine: 'lu-no-pivoting', typeCheck: 'skip', limits });
    expect(out.ok || [out.stage, out.status, out.message]).toEqual([
      'load',
      'invalid-output',
      'The kernel does not export a function named factor (found undefined).',
    ]);
  });

  it('refuses bad arguments and calls after dispose', async () => {
    const loaded = await loadKernel({ source: good, routine: 'lu-no-pivoting', limits });
    if (!loaded.ok) throw new Error(loaded.message);
    const { kernel } = loaded;
    expect(() => kernel.call({ a: new Float64Array(6), m: 2, n: 3 })).toThrow(RangeError);
    expect(() => kernel.call({ a: new Float64Array(4), m: 2, n: 3 })).toThrow(
      /args.a must have length m·n = 6/,
    );
    expect(() => kernel.call({ a: [1, 2, 3, 4] as unknown as Float64Array, m: 2, n: 2 })).toThrow(
      TypeError,
    );
    expect(() => kernel.time({ a: new Float64Array(4), m: 2, n: 2 }, { repeat: 0 })).toThrow(
      RangeError,
    );
    kernel.dispose();
    await expect(kernel.call({ a: new Float64Array(4), m: 2, n: 2 })).rejects.toThrow(/disposed/);
  });

  it('refuses invalid limits by name', async () => {
    await expect(
      loadKernel({ source: good, routine: 'lu-no-pivoting', limits: { memoryMb: 4 } }),
    ).rejects.toThrow(/limits.memoryMb must be at least 8/);
    await expect(
      loadKernel({ source: good, routine: 'lu-no-pivoting', limits: { callTimeoutMs: -1 } }),
    ).rejects.toThrow(/limits.callTimeoutMs must be a positive number/);
  });

  it('runs concurrent calls on one instance one at a time, each on its own input', async () => {
    const loaded = await loadKernel({
      source: readKernelSource(starterKernelFiles['back-substitution']),
      routine: 'back-substitution',
      limits,
    });
    if (!loaded.ok) throw new Error(loaded.message);
    const u = Float64Array.from([2, 0, 0, 4]);
    const calls = [1, 2, 3].map((k) =>
      loaded.kernel.call({ a: u, m: 2, n: 2, b: Float64Array.from([2 * k, 4 * k]) }),
    );
    const results = await Promise.all(calls);
    // U = diag(2, 4), b = (2k, 4k): x = (k, k).
    expect(results.map((r) => Array.from(r.result!.x))).toEqual([
      [1, 1],
      [2, 2],
      [3, 3],
    ]);
    loaded.kernel.dispose();
  });
});
