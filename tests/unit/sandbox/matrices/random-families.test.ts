import { describe, expect, it } from 'vitest';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { createRandom } from '@sandbox/matrices/random.ts';
import { randomOrthogonal } from '@sandbox/matrices/random-orthogonal.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { matmul, transpose } from '@tests/helpers/dense-matrix.ts';
import { gepp, luSolve } from '@tests/helpers/factorizations.ts';

/**
 * σ_max and σ_min of a square A: power iteration on AᵀA applied as Aᵀ(A·x), and inverse
 * iteration x ← A⁻¹A⁻ᵀx through GEPP solves, never forming AᵀA (Golub & Van Loan, 4th ed., §8.2).
 */
function extremeSingularValues(
  a: Float64Array,
  n: number,
  iterations: number,
): { min: number; max: number } {
  const at = transpose(a, n, n);
  const luA = gepp(a, n);
  const luAt = gepp(at, n);
  const run = (step: (x: Float64Array) => Float64Array) => {
    let x = Float64Array.from({ length: n }, (_, i) => 1 + i / n);
    let ratio = 0;
    for (let k = 0; k < iterations; k++) {
      const y = step(x);
      const ny = Math.sqrt(y.reduce((s, v) => s + v * v, 0));
      const nx = Math.sqrt(x.reduce((s, v) => s + v * v, 0));
      ratio = ny / nx;
      x = y.map((v) => v / ny);
    }
    return ratio;
  };
  const max = Math.sqrt(run((x) => matmul(at, matmul(a, x, n, n, 1), n, n, 1)));
  const min = 1 / Math.sqrt(run((x) => luSolve(luA, luSolve(luAt, x, n), n)));
  return { min, max };
}

describe('randomOrthogonal', () => {
  it('is orthogonal to working accuracy', () => {
    // ‖I − QᵀQ‖₁/(n·u) is about 0.7 for Householder QR at n = 100 (references §4.10).
    const n = 60;
    const q = randomOrthogonal(n, createRandom(1));
    const g = matmul(transpose(q, n, n), q, n, n, n); // QᵀQ
    let worst = 0;
    for (let j = 0; j < n; j++) {
      let col = 0;
      for (let i = 0; i < n; i++) col += Math.abs((i === j ? 1 : 0) - g[i * n + j]!);
      worst = Math.max(worst, col);
    }
    expect(worst / (n * UNIT_ROUNDOFF)).toBeLessThan(5);
  });

  it('is Haar: tr Q has mean 0 and variance 1 at n = 5', () => {
    // Diaconis & Shahshahani 1994 (from memory), references §4.10 and §11 row 33: N = 40 000,
    // mean within 3/√N, variance within 5 %. Without the sign fix the mean would be about −1.07.
    const random = createRandom(2024);
    const count = 40_000;
    let sum = 0;
    let sumSq = 0;
    for (let k = 0; k < count; k++) {
      const q = randomOrthogonal(5, random);
      const t = q[0]! + q[6]! + q[12]! + q[18]! + q[24]!;
      sum += t;
      sumSq += t * t;
    }
    const mean = sum / count;
    expect(Math.abs(mean)).toBeLessThan(3 / Math.sqrt(count));
    expect(Math.abs(sumSq / count - mean * mean - 1)).toBeLessThan(0.05);
  });
});

describe('prescribed-condition', () => {
  it('has κ₂ = cond to within 10·n·u·cond', () => {
    // DLATM1 MODE 3 with Haar U, V: references §4.9 and §11 row 32.
    for (const [n, cond] of [
      [30, 1e6],
      [20, 1e10],
    ] as const) {
      const a = generateMatrix({ family: 'prescribed-condition', n, seed: 3, params: { cond } });
      const { min, max } = extremeSingularValues(a.data, n, 300);
      expect(Math.abs(max / min / cond - 1)).toBeLessThan(10 * n * UNIT_ROUNDOFF * cond);
      expect(Math.abs(max - 1)).toBeLessThan(1e-12);
      expect(a.id).toBe(`prescribed-condition-n${n}-s3${cond === 1e6 ? '' : '-cond1e10'}`);
    }
  });
});

describe('uniform, normal and tall-random', () => {
  it('draw from [−1, 1) and standard normals, row by row from the family stream', () => {
    const u = generateMatrix({ family: 'uniform', n: 50, seed: 7 });
    expect(u.data.every((x) => x >= -1 && x < 1)).toBe(true);
    const mean = u.data.reduce((s, x) => s + x, 0) / u.data.length;
    // Uniform(−1, 1): mean 0, standard deviation 1/√3; 5 standard errors of 2500 draws is 0.058.
    expect(Math.abs(mean)).toBeLessThan(0.058);
    const z = generateMatrix({ family: 'normal', n: 50, seed: 7 });
    const zMean = z.data.reduce((s, x) => s + x, 0) / z.data.length;
    const zVar = z.data.reduce((s, x) => s + (x - zMean) ** 2, 0) / z.data.length;
    expect(Math.abs(zMean)).toBeLessThan(0.1);
    expect(Math.abs(zVar - 1)).toBeLessThan(0.15);
  });

  it('makes tall m×n matrices, m = 2n by default, for QR only', () => {
    const t = generateMatrix({ family: 'tall-random', n: 5, seed: 1 });
    expect([t.m, t.n, t.data.length]).toEqual([10, 5, 50]);
    expect(t.id).toBe('tall-random-n5-m10-s1');
    expect(t.properties.expectations).toEqual({ 'householder-qr': 'factor' });
    const s = generateMatrix({ family: 'tall-random', n: 5, m: 7, seed: 1 });
    expect(s.m).toBe(7);
    expect(() => generateMatrix({ family: 'tall-random', n: 5, m: 4 })).toThrow(/m ≥ n/);
  });
});
