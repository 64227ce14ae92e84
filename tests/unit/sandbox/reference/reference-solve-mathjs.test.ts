// The one test file that loads mathjs (slow to import): the reference solver against a
// general-purpose library from the registry (architecture.md, "The reference solver ...").
import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { matVecAccurate } from '@sandbox/numerics/accurate-residual.ts';
import { vectorNormInf } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { referenceSolve } from '@sandbox/reference/reference-solve.ts';
import { seededUniform } from '@tests/helpers/seeded-random.ts';

/** x with A x = b by mathjs lusolve, for an n×n row-major A. */
function mathjsSolve(a: Float64Array, n: number, b: Float64Array): Float64Array {
  const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
  return Float64Array.from(lusolve(rows, Array.from(b)) as number[][], (row) => row[0]!);
}

/** ‖x − y‖∞ / ‖y‖∞. */
function relativeDifference(x: ArrayLike<number>, y: ArrayLike<number>): number {
  return vectorNormInf(Array.from(x, (v, i) => v - y[i]!)) / vectorNormInf(y);
}

describe('referenceSolve against mathjs lusolve', () => {
  it('agrees within 4n·κ₁·u on random well-conditioned matrices, n = 5…60', () => {
    // mathjs solves with its own LU in double, whose forward error is of order n·κ·u (Higham,
    // ASNA 2nd ed., §9.4 and §7.1 rule of thumb, from memory); the reference is within ~u of
    // the exact solution, so the difference is bounded by the library's error. Matrices:
    // uniform(−1, 1) entries plus n/2 on the diagonal, so κ₁ stays modest (invented data).
    const rand = seededUniform(60);
    for (const n of [5, 8, 13, 21, 34, 60]) {
      const a = Float64Array.from({ length: n * n }, rand);
      for (let i = 0; i < n; i++) a[i * n + i]! += n / 2;
      const xTrue = Float64Array.from({ length: n }, rand);
      const b = matVecAccurate(a, n, n, xTrue);
      const ref = referenceSolve(a, n, b);
      expect(ref.trusted).toBe(true);
      const diff = relativeDifference(mathjsSolve(a, n, b), ref.x);
      expect(diff).toBeLessThanOrEqual(4 * n * ref.conditionEstimate * UNIT_ROUNDOFF);
      // Both also solve the system the right-hand side came from, to within κ·u of x_true.
      expect(relativeDifference(ref.x, xTrue)).toBeLessThanOrEqual(
        4 * ref.conditionEstimate * UNIT_ROUNDOFF,
      );
    }
  });

  it('agrees on random matrices without diagonal boost (κ₁ up to ~1e4), n = 10, 40', () => {
    const rand = seededUniform(7);
    for (const n of [10, 40]) {
      const a = Float64Array.from({ length: n * n }, rand);
      const b = Float64Array.from({ length: n }, rand);
      const ref = referenceSolve(a, n, b);
      expect(ref.trusted).toBe(true);
      const diff = relativeDifference(mathjsSolve(a, n, b), ref.x);
      expect(diff).toBeLessThanOrEqual(4 * n * ref.conditionEstimate * UNIT_ROUNDOFF);
    }
  });
});
