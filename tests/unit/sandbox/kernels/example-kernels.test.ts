import { describe, expect, it } from 'vitest';
import type { RoutineSlug } from '@shared/routines.ts';
import type { RoutineResult } from '@sandbox/contracts/routine-results.ts';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import type { CallArgs } from '@sandbox/isolate/transfer.ts';
import { typeCheckKernel } from '@sandbox/isolate/type-check.ts';
import { exampleKernels, type ExampleName } from '@sandbox/kernels/example-catalog.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { randomMatrix } from '@tests/helpers/test-matrices.ts';
import { luRatio, RATIO_THRESHOLD } from '@tests/unit/sandbox/kernels/factor-checks.ts';
import { residualRatios, sampleArgs } from '@tests/unit/sandbox/kernels/routine-checks.ts';

const limits = { callTimeoutMs: 300, loadTimeoutMs: 300, memoryMb: 64 };
const names = Object.keys(exampleKernels) as ExampleName[];
const byVerdict = (verdict: string) =>
  names.filter((n) => exampleKernels[n].expected.verdict === verdict);

/** The LU examples' results (the catalog types `routine` as any RoutineSlug). */
const factors = (out: { result?: unknown }) => out.result as RoutineResult<'lu-partial-pivoting'>;

/** Loads an example and makes one call. */
async function run(name: ExampleName, args: CallArgs) {
  const { routine, file } = exampleKernels[name];
  const loaded = await loadKernel({
    source: readKernelSource(file),
    routine: routine as RoutineSlug,
    limits,
  });
  if (!loaded.ok) throw new Error(`${name}: ${loaded.stage}: ${loaded.message}`);
  const out = await loaded.kernel.call(args);
  loaded.kernel.dispose();
  return out;
}

describe('the example catalog', () => {
  it.each(names)('%s type-checks clean against its routine', (name) => {
    const { routine, file } = exampleKernels[name];
    expect(typeCheckKernel(readKernelSource(file), routine).diagnostics).toEqual([]);
  });

  it('names an existing example of the same routine for every slower kernel', () => {
    for (const name of byVerdict('slower')) {
      const expected = exampleKernels[name].expected as { than: string };
      const than = exampleKernels[expected.than as ExampleName];
      expect(than?.routine).toBe(exampleKernels[name].routine);
    }
  });
});

describe('sound examples', () => {
  it.each(byVerdict('sound'))('%s factors random matrices with ratios below 30', async (name) => {
    const routine = exampleKernels[name].routine as RoutineSlug;
    for (const [n, seed] of [
      [1, 1],
      [9, 2],
      [40, 3],
    ] as const) {
      const args = sampleArgs(routine, n, seed);
      const out = await run(name, args);
      expect([out.status, out.message]).toEqual(['ok', undefined]);
      // Pass threshold 30: LAPACK TESTING/dtest.in (numerics-references.md §1.2).
      for (const ratio of residualRatios(routine, args, out.result!))
        expect(ratio).toBeLessThan(RATIO_THRESHOLD);
    }
  });
});

describe('flawed examples show their flaw', () => {
  it('LU without pivoting offered as pivoted: factor ratio 2^51 on [[1e-20, 1], [1, 1]]', async () => {
    // Check value: numerics-references.md §11 row 39 (no pivoting: GET01 ratio 2^51; GEPP: 0).
    const a = Float64Array.from([1e-20, 1, 1, 1]);
    const bad = await run('lu-no-pivoting-offered-as-pivoting', { a, m: 2, n: 2 });
    expect(luRatio(a, factors(bad).lu, factors(bad).perm, 2)).toBe(2 ** 51);
    const good = await run('lu-partial-pivoting-right-looking', { a, m: 2, n: 2 });
    expect(luRatio(a, factors(good).lu, factors(good).perm, 2)).toBe(0);
  });

  it.each(['lu-single-precision-updates', 'lu-pivots-identity-perm'] as const)(
    '%s fails the factor ratio on a random matrix',
    async (name) => {
      const a = randomMatrix(24, 24, 5);
      const out = await run(name, { a, m: 24, n: 24 });
      expect(out.status).toBe('ok');
      // Far beyond the threshold 30 (LAPACK dtest.in); binary32 rounding alone is 2^29 times u.
      expect(luRatio(a, factors(out).lu, factors(out).perm, 24)).toBeGreaterThan(
        100 * RATIO_THRESHOLD,
      );
    },
  );

  it('the column-stride LU computes exactly what the right-looking one does', async () => {
    // Same operations in the same order for every entry, only the loop nest differs; its
    // slowness is a benchmark matter, never a timed assertion here.
    const a = randomMatrix(20, 20, 8);
    const slow = await run('lu-column-stride', { a, m: 20, n: 20 });
    const fast = await run('lu-partial-pivoting-right-looking', { a, m: 20, n: 20 });
    expect(slow.result).toEqual(fast.result);
  });

  it('the Cholesky without a definiteness check returns numbers for an indefinite matrix', async () => {
    // [[1, 2], [2, 1]] has eigenvalues 3 and −1 (invented example): it must be rejected.
    const a = Float64Array.from([1, 2, 2, 1]);
    const sound = await run('cholesky-row-oriented', { a, m: 2, n: 2 });
    expect([sound.status, sound.message]).toEqual([
      'threw',
      'Error: not positive definite: pivot -3 at column 1',
    ]);
    const flawed = await run('cholesky-no-definiteness-check', { a, m: 2, n: 2 });
    expect(flawed.status).toBe('ok');
  });

  it.each(byVerdict('call-fails'))('%s ends every call with its expected status', async (name) => {
    const expected = exampleKernels[name].expected as { status: string; messageIncludes?: string };
    const out = await run(name, { a: randomMatrix(5, 5, 9), m: 5, n: 5 });
    expect(out.status).toBe(expected.status);
    if (expected.messageIncludes) expect(out.message).toContain(expected.messageIncludes);
  });
});
