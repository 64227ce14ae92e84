// The one test file that loads mathjs (slow to import): the reference solver against a
// general-purpose library from the registry (architecture.md, "The reference solver ...").
import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { matVecAccurate } from '@sandbox/numerics/accurate-residual.ts';
import { vectorNormInf } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { referenceSolve } from '@sandbox/reference/reference-solve.ts';

function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('referenceSolve against mathjs lusolve', () => {
  it('agrees within 4n·κ₁·u on random well-conditioned matrices, n = 5…60', () => {
    // mathjs solves with its own LU in double, whose forward error is of order n·κ·u (Higham,
    // ASNA 2nd ed., §9.4 and §7.1 rule of thumb, from memory); the reference is within ~u of
    // the exact solution, so the difference is bounded by the library's error. Matrices:
    // uniform(−1, 1) entries plus n/2 on the diagonal, so κ₁ stays modest (invented data).
    const rand = seeded(60);
    for (const n of [5, 8, 13, 21, 34, 60]) {
      const a = Float64Array.from({ length: n * n }, () => 2 * rand() - 1);
      for (let i = 0; i < n; i++) a[i * n + i]! += n / 2;
      const xTrue = Float64Array.from({ length: n }, () => 2 * rand() - 1);
      const b = matVecAccurate(a, n, n, xTrue);
      const ref = referenceSolve(a, n, b);
      expect(ref.trusted).toBe(true);
      const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
      const solved = lusolve(rows, Array.from(b)) as number[][];
      const x = Float64Array.from(solved, (row) => row[0]!);
      const diff = vectorNormInf(x.map((v, i) => v - ref.x[i]!)) / vectorNormInf(ref.x);
      expect(diff).toBeLessThanOrEqual(4 * n * ref.conditionEstimate * UNIT_ROUNDOFF);
      // Both also solve the system the right-hand side came from, to within κ·u of x_true.
      const fromTrue = vectorNormInf(ref.x.map((v, i) => v - xTrue[i]!)) / vectorNormInf(xTrue);
      expect(fromTrue).toBeLessThanOrEqual(4 * ref.conditionEstimate * UNIT_ROUNDOFF);
    }
  });

  it('agrees on random matrices without diagonal boost (κ₁ up to ~1e4), n = 10, 40', () => {
    const rand = seeded(7);
    for (const n of [10, 40]) {
      const a = Float64Array.from({ length: n * n }, () => 2 * rand() - 1);
      const b = Float64Array.from({ length: n }, () => 2 * rand() - 1);
      const ref = referenceSolve(a, n, b);
      expect(ref.trusted).toBe(true);
      const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
      const x = Float64Array.from(lusolve(rows, Array.from(b)) as number[][], (row) => row[0]!);
      const diff = vectorNormInf(x.map((v, i) => v - ref.x[i]!)) / vectorNormInf(ref.x);
      expect(diff).toBeLessThanOrEqual(4 * n * ref.conditionEstimate * UNIT_ROUNDOFF);
    }
  });
});
