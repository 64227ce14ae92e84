import { describe, expect, it } from 'vitest';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { luFactorPartialPivoting } from '@sandbox/reference/gepp.ts';
import { luFactorDoubleDouble, luSolveDoubleDouble } from '@sandbox/reference/lu-double-double.ts';
import {
  type Rational,
  ONE,
  ZERO,
  abs,
  add,
  compare,
  condition1Exact,
  div,
  fromDouble,
  fromDoubles,
  mul,
  solveExact,
  sub,
  toNumber,
} from '@tests/helpers/rational.ts';
import { hilbert } from '@tests/helpers/test-matrices.ts';

const u2 = UNIT_ROUNDOFF ** 2;

function factorOk(a: ArrayLike<number>, n: number) {
  const f = luFactorDoubleDouble(a, n);
  if (!f.ok) throw new Error(`unexpected zero pivot in column ${f.column}`);
  return f;
}

/** The exact value hi + lo of each factor entry. */
const ddValues = (hi: Float64Array, lo: Float64Array): Rational[] =>
  Array.from(hi, (h, k) => add(fromDouble(h), fromDouble(lo[k]!)));

/** max_ij |PA − LU|_ij / (|L||U|)_ij with L, U the double-double factors, exactly. */
function componentwiseResidual(a: Float64Array, n: number): number {
  const f = factorOk(a, n);
  const v = ddValues(f.hi, f.lo);
  const A = fromDoubles(a);
  let worst = 0;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s: Rational = ZERO;
      let t: Rational = ZERO;
      for (let k = 0; k <= Math.min(i, j); k++) {
        const l = k === i ? ONE : v[i * n + k]!;
        const p = mul(l, v[k * n + j]!);
        s = add(s, p);
        t = add(t, abs(p));
      }
      const r = abs(sub(A[f.perm[i]! * n + j]!, s));
      if (r.num !== 0n) worst = Math.max(worst, toNumber(div(r, t)));
    }
  return worst;
}

describe('luFactorDoubleDouble', () => {
  it('matches double GEPP exactly when every operation is exact (hand-built matrix)', () => {
    // The invented matrix of gepp.test.ts: dyadic multipliers, so lo parts are all zero.
    const a = [2, 5, 6, -1, 3.5, -4, 4, -2, 8];
    const f = factorOk(a, 3);
    const g = luFactorPartialPivoting(a, 3);
    expect(g.ok && Array.from(g.lu)).toEqual(Array.from(f.hi));
    expect(Array.from(f.lo)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0]);
    expect(Array.from(f.perm)).toEqual([2, 0, 1]);
  });

  it('has a backward error of order n·u² on fl(H_n), n = 6…12, checked exactly', () => {
    // The double-double analogue of Higham, ASNA 2nd ed., Thm 9.3 (from memory), with the
    // unit roundoff u replaced by a few u² (the operations' error, double-double.test.ts).
    for (const n of [6, 9, 12]) {
      const worst = componentwiseResidual(hilbert(n), n);
      expect(worst).toBeLessThanOrEqual(4 * n * u2);
    }
  });

  it('finds no zero pivot where double GEPP finds one by rounding: [[3,1],[1,fl(1/3)]]', () => {
    // In double, 1/3 − fl(1/3)·1 with multiplier fl(1/3) is exactly 0; the matrix is not
    // singular (det = 3·fl(1/3) − 1 = −2^-54, worked by hand from fl(1/3) = (1 − 2^-54)/3).
    const a = [3, 1, 1, 1 / 3];
    expect(luFactorPartialPivoting(a, 2).ok).toBe(false);
    const f = factorOk(a, 2);
    expect(f.hi[3]).not.toBe(0);
    const det = sub(mul(fromDouble(3), fromDouble(1 / 3)), ONE);
    expect(toNumber(det)).toBe(-(2 ** -54));
  });

  it('reports an exactly singular matrix: [[1,2],[2,4]]', () => {
    expect(luFactorDoubleDouble([1, 2, 2, 4], 2)).toEqual({
      ok: false,
      reason: 'singular',
      column: 1,
    });
  });

  it('rejects bad arguments', () => {
    expect(() => luFactorDoubleDouble([1, 2, 3], 2)).toThrow(/a must hold/);
    expect(() => luFactorDoubleDouble([], -2)).toThrow(/n must be/);
  });
});

describe('luSolveDoubleDouble', () => {
  it('solves fl(H_n) x = b to within 8n·κ₁·u² of the exact solution, n = 6…12', () => {
    // Forward error ≲ κ × backward error (Higham, ASNA 2nd ed., §7.1, from memory), with the
    // exact κ₁ of the stored matrix from rational inversion (numerics-references §4.1).
    for (const n of [6, 9, 12]) {
      const a = hilbert(n);
      const b = Float64Array.from({ length: n }, (_, i) => (i % 3) - 1 + 0.25 * i);
      const f = factorOk(a, n);
      const x = luSolveDoubleDouble(f, b, new Float64Array(n), n);
      const exact = solveExact(fromDoubles(a), n, fromDoubles(b))!;
      let err: Rational = ZERO;
      let norm: Rational = ZERO;
      for (let i = 0; i < n; i++) {
        const e = abs(sub(add(fromDouble(x.hi[i]!), fromDouble(x.lo[i]!)), exact[i]!));
        if (compare(e, err) > 0) err = e;
        if (compare(abs(exact[i]!), norm) > 0) norm = abs(exact[i]!);
      }
      const kappa = toNumber(condition1Exact(fromDoubles(a), n)!);
      const relative = toNumber(div(err, norm));
      expect(relative).toBeLessThanOrEqual(8 * n * kappa * u2);
      // And far beyond double precision where κ·u² is small: fl(H_6) has κ₁ ≈ 2.9e7.
      if (n === 6) expect(relative).toBeLessThan(1e-20);
    }
  });

  it('uses the low parts of the right-hand side', () => {
    // A = I₂: x = b exactly, low parts included.
    const f = factorOk([1, 0, 0, 1], 2);
    const x = luSolveDoubleDouble(f, [1, 2], [2 ** -60, -(2 ** -70)], 2);
    expect(Array.from(x.hi)).toEqual([1, 2]);
    expect(Array.from(x.lo)).toEqual([2 ** -60, -(2 ** -70)]);
  });

  it('rejects mismatched sizes', () => {
    const f = factorOk([1, 0, 0, 1], 2);
    expect(() => luSolveDoubleDouble(f, [1], [0], 2)).toThrow(/bHi and bLo/);
    expect(() => luSolveDoubleDouble(f, [1, 2, 3], [0, 0, 0], 3)).toThrow(/factors must be/);
  });
});
