import { describe, expect, it } from 'vitest';
import { mannWhitneyProbabilities } from '@sandbox/stats/mann-whitney-distribution.ts';
import { mannWhitneyU } from '@sandbox/stats/mann-whitney.ts';

/** Brute force: U = #{x > y pairs} over every choice of which m of the ranks 1..m+n belong to x. */
function bruteForceCounts(m: number, n: number): number[] {
  const counts = new Array<number>(m * n + 1).fill(0);
  for (let mask = 0; mask < 2 ** (m + n); mask++) {
    let bits = 0;
    for (let k = 0; k < m + n; k++) if (mask & (1 << k)) bits++;
    if (bits !== m) continue;
    let u = 0;
    let ysBelow = 0; // scanning ranks upwards: each x beats every y below it
    for (let k = 0; k < m + n; k++) {
      if (mask & (1 << k)) u += ysBelow;
      else ysBelow++;
    }
    counts[u]!++;
  }
  return counts;
}

describe('exact Mann–Whitney distribution', () => {
  it('matches brute-force enumeration of all C(m+n, m) arrangements', () => {
    for (const [m, n] of [
      [1, 1],
      [2, 3],
      [4, 4],
      [3, 7],
      [6, 5],
    ] as const) {
      const total = bruteForceCounts(m, n).reduce((a, b) => a + b, 0);
      const expected = bruteForceCounts(m, n).map((c) => c / total);
      const p = mannWhitneyProbabilities(m, n);
      expect(p.length).toBe(m * n + 1);
      expected.forEach((e, u) => expect(p[u]).toBeCloseTo(e, 14));
    }
  });

  it('has the tabled 8 vs 8 lower tail (numerics-references §8.5, [computed])', () => {
    const p = mannWhitneyProbabilities(8, 8);
    const tail13 = p.slice(0, 14).reduce((a, b) => a + b, 0);
    expect(tail13).toBeCloseTo(0.0249417, 7);
  });
});

describe('mannWhitneyU', () => {
  it('x = 1..5, y = 6..10: U = 0, exact two-sided p = 2/252 (§8.5, SciPy 1.17 [computed])', () => {
    const result = mannWhitneyU([1, 2, 3, 4, 5], [6, 7, 8, 9, 10]);
    expect(result.u).toBe(0);
    expect(result.method).toBe('exact');
    expect(result.pValue).toBeCloseTo(2 / 252, 12);
    expect(result.pValue).toBeCloseTo(0.0079365079, 10);
  });

  it('tie example: U = 15, Var = 107.2058824, z = 1.9799059, p = 0.0477141 (§8.5, = SciPy)', () => {
    const x = [1.1, 2.0, 2.0, 3.5, 4.2, 5.0, 6.3, 7.7];
    const y = [2.0, 3.5, 5.0, 5.9, 8.1, 8.8, 9.4, 9.9, 10.2];
    const result = mannWhitneyU(x, y);
    expect(result.method).toBe('normal'); // ties force the normal approximation
    expect(result.u).toBe(15);
    expect(result.variance).toBeCloseTo(107.2058824, 7);
    expect(Math.abs(result.z!)).toBeCloseTo(1.9799059, 7);
    expect(result.pValue).toBeCloseTo(0.0477141, 7);
    // Without ties the variance would be mn(N+1)/12 = 108 (§8.5).
    expect((x.length * y.length * (x.length + y.length + 1)) / 12).toBe(108);
  });

  it('timing example: U_A = 57, exact p = 0.0069930, asymptotic 0.0100817 (§8.5)', () => {
    const tA = [1.021, 1.003, 1.048, 0.991, 1.012, 1.197, 1.034, 1.006];
    const tB = [0.951, 0.932, 0.962, 0.973, 0.944, 1.102, 0.957, 0.968];
    const exact = mannWhitneyU(tA, tB);
    expect(exact.u).toBe(57);
    expect(exact.pValue).toBeCloseTo(0.006993, 7);
    expect(mannWhitneyU(tA, tB, { method: 'normal' }).pValue).toBeCloseTo(0.0100817, 7);
  });

  it('returns U of the first sample: swapping gives mn − U and the same p', () => {
    const x = [3.1, 0.4, 2.2, 5.0];
    const y = [1.0, 4.4, 0.9, 6.1, 2.8];
    const a = mannWhitneyU(x, y);
    const b = mannWhitneyU(y, x);
    expect(a.u + b.u).toBe(20);
    expect(a.pValue).toBeCloseTo(b.pValue, 14);
  });

  it('rejects empty samples, non-finite values and an exact request with ties', () => {
    expect(() => mannWhitneyU([], [1])).toThrow(/x must not be empty/);
    expect(() => mannWhitneyU([1], [NaN])).toThrow(/y\[0\]/);
    expect(() => mannWhitneyU([1, 2], [2, 3], { method: 'exact' })).toThrow(RangeError);
  });
});
