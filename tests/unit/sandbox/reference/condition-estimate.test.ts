import { describe, expect, it } from 'vitest';
import { norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  conditionEstimate1,
  conditionEstimate1FromLu,
  inverseNorm1Estimate,
} from '@sandbox/reference/condition-estimate.ts';
import { luFactorPartialPivoting } from '@sandbox/reference/gepp.ts';
import {
  type Rational,
  ZERO,
  add,
  condition1Exact,
  equals,
  fromDoubles,
  inverseExact,
  rational,
  toNumber,
} from '@tests/helpers/rational.ts';
import { seededUniform } from '@tests/helpers/seeded-random.ts';
import { hilbert, worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

const u = UNIT_ROUNDOFF;

function hilbertExact(n: number): Rational[] {
  const a: Rational[] = [];
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a.push(rational(1, i + j + 1));
  return a;
}

/** T_n = tridiag(−1, 2, −1). */
function secondDifference(n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    a[i * n + i] = 2;
    if (i > 0) a[i * n + i - 1] = -1;
    if (i < n - 1) a[i * n + i + 1] = -1;
  }
  return a;
}

/** Kahan K_n(θ) in Higham's convention: diag(1, s, …, s^{n−1})·(I − c·strict upper ones). */
function kahan(n: number, theta: number): Float64Array {
  const s = Math.sin(theta);
  const c = Math.cos(theta);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const d = s ** i;
    a[i * n + i] = d;
    for (let j = i + 1; j < n; j++) a[i * n + j] = -c * d;
  }
  return a;
}

/**
 * numerics-references §11 row 41 (and §5): the estimate is a lower bound up to rounding, and on
 * the reference suite est ≥ true/3 (a heuristic, common practice; Higham 1988 reports the
 * estimate usually exact or within a small factor; ASNA 2nd ed., §15.3 — from memory). Row 41's
 * upper slack 10nu assumes exact products; ours are solves in double whose relative error is up
 * to about n·κ·u (Higham, ASNA 2nd ed., §7.1 rule of thumb, from memory), so the slack here is
 * 10·n·κ·u. Seen on fl(H₄): estimate 28374.99999999738 against the exact 28374.99999999624.
 */
function expectGoodEstimate(est: number, truth: number, n: number): void {
  expect(est).toBeLessThanOrEqual(truth * (1 + 10 * n * u * Math.max(1, truth)));
  expect(est).toBeGreaterThanOrEqual(truth / 3);
}

describe('exact reference values (tests/helpers/rational.ts against published values)', () => {
  it('κ₁(H_n) of the exact Hilbert matrix, n = 2…10', () => {
    // numerics-references §11 row 15 (§4.1 table, computed with BigInt rationals; n = 3 also
    // MathWorks `cond` documentation).
    const table: [bigint, bigint][] = [
      [27n, 1n],
      [748n, 1n],
      [28375n, 1n],
      [943656n, 1n],
      [29070279n, 1n],
      [1970389773n, 2n],
      [33872791095n, 1n],
      [2199309082685n, 2n],
      [35357439251992n, 1n],
    ];
    table.forEach(([num, den], k) => {
      const n = k + 2;
      expect(equals(condition1Exact(hilbertExact(n), n)!, rational(num, den))).toBe(true);
    });
  });

  it('H₄⁻¹ is the published integer matrix; the entries of H_n⁻¹ sum to n²', () => {
    // numerics-references §11 rows 13 (SciPy invhilbert docs) and 14 (Burkardt hilbert.py).
    const inv = inverseExact(hilbertExact(4), 4)!;
    expect(inv.map(toNumber)).toEqual([
      16, -120, 240, -140, -120, 1200, -2700, 1680, 240, -2700, 6480, -4200, -140, 1680, -4200,
      2800,
    ]);
    for (const n of [3, 7]) {
      const sum = inverseExact(hilbertExact(n), n)!.reduce((s, v) => add(s, v), ZERO);
      expect(equals(sum, rational(n * n))).toBe(true);
    }
  });

  it('κ₁ of the stored fl(H₁₀) differs from κ₁(H₁₀): 3.5354248023e13', () => {
    // numerics-references §4.1 second table (computed exactly from the double entries).
    const k = toNumber(condition1Exact(fromDoubles(hilbert(10)), 10)!);
    expect(Math.abs(k / 3.5354248023e13 - 1)).toBeLessThan(1e-10);
  });
});

describe('conditionEstimate1 (Hager 1984; Higham 1988; LAPACK DGECON/DLACN2)', () => {
  it('on fl(H_n), n = 2…10: a lower bound within a factor 3 of the exact κ₁', () => {
    for (let n = 2; n <= 10; n++) {
      const a = hilbert(n);
      const truth = toNumber(condition1Exact(fromDoubles(a), n)!);
      expectGoodEstimate(conditionEstimate1(a, n), truth, n);
    }
  });

  it('on the §5 check matrices: H₆, T₅₀, W₂₀, Kahan₃₀', () => {
    // numerics-references §5 / §11 row 41: true κ₁ = 2.907028e7 (H₆), 1300 (T₅₀),
    // 20 (W₂₀, §11 row 10), 2.879369e5 (Kahan₃₀, θ = 1.2, §4.7); values rounded to 7 digits,
    // hence the 1e-6 slack in the upper bound.
    const cases: [Float64Array, number, number][] = [
      [hilbert(6), 6, 2.907028e7],
      [secondDifference(50), 50, 1300],
      [worstGrowthMatrix(20), 20, 20],
      [kahan(30, 1.2), 30, 2.879369e5],
    ];
    for (const [a, n, truth] of cases) {
      const est = conditionEstimate1(a, n);
      expect(est).toBeLessThanOrEqual(truth * (1 + 1e-6));
      expect(est).toBeGreaterThanOrEqual(truth / 3);
    }
  });

  it('on T_n against κ₁(T_n) = 4·max_j j(n+1−j)/2: 18, 60, 5100', () => {
    // numerics-references §11 row 27 (derived from the explicit inverse, dif2.py).
    for (const [n, truth] of [
      [5, 18],
      [10, 60],
      [100, 5100],
    ] as const) {
      expectGoodEstimate(conditionEstimate1(secondDifference(n), n), truth, n);
    }
  });

  it('on random integer matrices, n = 3…8: a lower bound within a factor 3 of the exact κ₁', () => {
    let seed = 99;
    const rand = () => (seed = (seed * 48271) % 2147483647);
    for (let trial = 0; trial < 12; trial++) {
      const n = 3 + (trial % 6);
      const a = Float64Array.from({ length: n * n }, () => (rand() % 21) - 10);
      const truth = condition1Exact(fromDoubles(a), n);
      if (truth === null) continue;
      expectGoodEstimate(conditionEstimate1(a, n), toNumber(truth), n);
    }
  });

  it('is Infinity for an exact zero pivot and huge for [[1,2,3],[4,5,6],[7,8,9]]', () => {
    expect(conditionEstimate1([1, 2, 2, 4], 2)).toBe(Infinity); // §11 row 35
    expect(conditionEstimate1([0, 0, 0, 0], 2)).toBe(Infinity);
    // numerics-references §11 row 36: rcond ≤ 10nu, i.e. κ₁ estimate ≥ 1/(10nu).
    expect(conditionEstimate1([1, 2, 3, 4, 5, 6, 7, 8, 9], 3)).toBeGreaterThanOrEqual(
      1 / (10 * 3 * u),
    );
  });

  it('small cases: n = 0 gives 1 (as DGECON), a 1×1 matrix gives 1', () => {
    expect(conditionEstimate1([], 0)).toBe(1);
    expect(conditionEstimate1([5], 1)).toBe(1);
    expect(conditionEstimate1([-0.25], 1)).toBe(1);
  });

  it('conditionEstimate1FromLu reuses existing factors and gives the same value', () => {
    const a = kahan(12, 1.2);
    const f = luFactorPartialPivoting(a, 12);
    if (!f.ok) throw new Error('unexpected zero pivot');
    expect(conditionEstimate1FromLu(f.lu, f.perm, 12, norm1(a, 12, 12))).toBe(
      conditionEstimate1(a, 12),
    );
    expect(conditionEstimate1FromLu(f.lu, f.perm, 12, 0)).toBe(Infinity);
  });
});

describe('inverseNorm1Estimate as a general 1-norm estimator', () => {
  /** Products with an explicit matrix B and its transpose, counting calls. */
  function explicit(b: Float64Array, n: number) {
    let calls = 0;
    const apply = (transposed: boolean) => (v: Float64Array) => {
      calls++;
      const y = new Float64Array(n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) y[i]! += (transposed ? b[j * n + i]! : b[i * n + j]!) * v[j]!;
      return y;
    };
    return { solve: apply(false), solveTransposed: apply(true), calls: () => calls };
  }

  it('never exceeds ‖B‖₁ and uses at most 11 products, on random matrices', () => {
    // DLACN2: at most ITMAX = 5 iterations of two products, plus the final test vector.
    const rand = seededUniform(5);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + (trial % 9);
      const b = Float64Array.from({ length: n * n }, rand);
      const ops = explicit(b, n);
      const est = inverseNorm1Estimate(ops.solve, ops.solveTransposed, n);
      expect(est).toBeLessThanOrEqual(norm1(b, n, n) * (1 + 10 * n * u));
      expect(est).toBeGreaterThanOrEqual(norm1(b, n, n) / 3);
      expect(ops.calls()).toBeLessThanOrEqual(11);
    }
  });

  it('is exact for a nonnegative matrix (the second step picks the largest column)', () => {
    // For B ≥ 0, Bᵀ·sign(Bx) = Bᵀ·1 is the vector of column sums (Hager 1984).
    const b = Float64Array.from([1, 7, 2, 0, 3, 1, 4, 0, 5]); // column sums 5, 10, 8
    const ops = explicit(b, 3);
    expect(inverseNorm1Estimate(ops.solve, ops.solveTransposed, 3)).toBe(10);
  });

  it('n = 0 gives 0 and n = 1 gives |b₁₁|; bad n throws', () => {
    const ops = explicit(Float64Array.from([-4]), 1);
    expect(inverseNorm1Estimate(ops.solve, ops.solveTransposed, 1)).toBe(4);
    expect(inverseNorm1Estimate(ops.solve, ops.solveTransposed, 0)).toBe(0);
    expect(() => inverseNorm1Estimate(ops.solve, ops.solveTransposed, -1)).toThrow(RangeError);
  });
});
