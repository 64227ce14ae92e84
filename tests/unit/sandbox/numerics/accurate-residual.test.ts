import { describe, expect, it } from 'vitest';
import {
  matVecAccurate,
  residualAccurate,
  residualAccurateDoubleDouble,
} from '@sandbox/numerics/accurate-residual.ts';
import { UNIT_ROUNDOFF, gamma } from '@sandbox/numerics/unit-roundoff.ts';
import { luFactorPartialPivoting, luSolve } from '@sandbox/reference/gepp.ts';
import {
  type Rational,
  ZERO,
  abs,
  add,
  fromDouble,
  mul,
  sub,
  toNumber,
} from '@tests/helpers/rational.ts';
import { seededUniform } from '@tests/helpers/seeded-random.ts';
import { hilbert } from '@tests/helpers/test-matrices.ts';

const u = UNIT_ROUNDOFF;

/** Exact r = b − A x and the scale (|b| + |A||x|) per row, both as rationals. */
function exactResidual(a: Float64Array, m: number, n: number, x: Float64Array, b: Float64Array) {
  const r: Rational[] = [];
  const scale: number[] = [];
  for (let i = 0; i < m; i++) {
    let s = fromDouble(b[i]!);
    let t = abs(s);
    for (let j = 0; j < n; j++) {
      const p = mul(fromDouble(a[i * n + j]!), fromDouble(x[j]!));
      s = sub(s, p);
      t = add(t, abs(p));
    }
    r.push(s);
    scale.push(toNumber(t));
  }
  return { r, scale };
}

/** An ill-conditioned residual: x from GEPP on fl(H_n), so b − A x cancels almost entirely. */
function hilbertCase(n: number) {
  const a = hilbert(n);
  const b = Float64Array.from({ length: n }, (_, i) => 1 + i / 7);
  const f = luFactorPartialPivoting(a, n);
  if (!f.ok) throw new Error('unexpected zero pivot');
  return { a, b, x: luSolve(f.lu, f.perm, b, n) };
}

describe('residualAccurate (Dot2: Ogita, Rump & Oishi 2005, Alg. 5.3)', () => {
  it('meets |r̂ − r| ≤ u|r| + γ_{n+1}²(|b| + |A||x|) on Hilbert residuals, n = 4…10', () => {
    // Dot2's error bound (Ogita, Rump & Oishi 2005, §5; quoted in numerics-references §6.1).
    let plainViolations = 0;
    for (let n = 4; n <= 10; n++) {
      const { a, b, x } = hilbertCase(n);
      const { r, scale } = exactResidual(a, n, n, x, b);
      const computed = residualAccurate(a, n, n, x, b);
      for (let i = 0; i < n; i++) {
        const exact = toNumber(r[i]!);
        const bound = u * Math.abs(exact) + gamma(n + 1) ** 2 * scale[i]!;
        const err = toNumber(abs(sub(fromDouble(computed[i]!), r[i]!)));
        expect(err).toBeLessThanOrEqual(bound);
        // The plain double residual misses this bound: the test can tell the two apart.
        let plain = b[i]!;
        for (let j = 0; j < n; j++) plain -= a[i * n + j]! * x[j]!;
        if (toNumber(abs(sub(fromDouble(plain), r[i]!))) > bound) plainViolations++;
      }
    }
    expect(plainViolations).toBeGreaterThan(10);
  });

  it('residualAccurateDoubleDouble: hi is the rounded residual, hi + lo much closer still', () => {
    for (const n of [5, 8, 10]) {
      const { a, b, x } = hilbertCase(n);
      const { r, scale } = exactResidual(a, n, n, x, b);
      const { hi, lo } = residualAccurateDoubleDouble(a, n, n, x, b);
      expect(hi).toEqual(residualAccurate(a, n, n, x, b));
      for (let i = 0; i < n; i++) {
        expect(hi[i]! + lo[i]!).toBe(hi[i]); // normalised pair
        const err = toNumber(abs(sub(add(fromDouble(hi[i]!), fromDouble(lo[i]!)), r[i]!)));
        // Derived from the TwoSum/TwoProduct error bounds: the 2n error terms have magnitude at
        // most (n + 1)·u·(|b| + |A||x|)_i and are summed in double, so with γ_{2n}:
        expect(err).toBeLessThanOrEqual(gamma(2 * n) * (n + 1) * u * scale[i]!);
      }
    }
  });

  it('shows the exact worst-growth factors are exact (numerics-references §1.5)', () => {
    // W_60: 1 on the diagonal, −1 below, 1 in the last column; GEPP (first-max ties) gives P = I,
    // L = the lower triangle of W, U = I except last column 2^i (Higham & Higham 1989; Burkardt
    // gfpp.py, both cited in numerics-references §3). (A − LU) column j = A e_j − L (U e_j).
    const n = 60;
    const A = new Float64Array(n * n);
    const L = new Float64Array(n * n);
    const Ucols: Float64Array[] = [];
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) {
        A[i * n + j] = i === j || j === n - 1 ? 1 : j < i ? -1 : 0;
        L[i * n + j] = i === j ? 1 : j < i ? -1 : 0;
      }
    for (let j = 0; j < n; j++)
      Ucols.push(
        Float64Array.from({ length: n }, (_, i) =>
          j === n - 1 ? (i <= j ? 2 ** i : 0) : i === j ? 1 : 0,
        ),
      );
    let accurate = 0;
    let plain = 0; // ‖LU − A‖₁ with LU formed in double, inner products in ascending order
    for (let j = 0; j < n; j++) {
      const aj = Float64Array.from({ length: n }, (_, i) => A[i * n + j]!);
      const r = residualAccurate(L, n, n, Ucols[j]!, aj);
      let column = 0;
      for (let i = 0; i < n; i++) {
        accurate += Math.abs(r[i]!);
        let s = 0;
        for (let k = 0; k < n; k++) s += L[i * n + k]! * Ucols[j]![k]!;
        column += Math.abs(s - aj[i]!);
      }
      plain = Math.max(plain, column);
    }
    // Accurate residual: exactly 0. Plain double in ascending order: rows 54…59 of the last
    // column lose the 1 (2^i − 1 is not a double for i ≥ 54), so ‖LU − A‖₁ = 6 and the
    // GET01-style ratio 6/(n·‖A‖₁·u) with ‖A‖₁ = 60 is about 1.5e13, as §1.5 reports.
    expect(accurate).toBe(0);
    expect(plain).toBe(6);
    expect(plain / (n * 60 * u)).toBeCloseTo(1.5e13, -12);
  });

  it('handles rectangular and empty shapes', () => {
    // [[1, 2, 3], [4, 5, 6]]·(1, 1, 1) = (6, 15).
    const a = Float64Array.from([1, 2, 3, 4, 5, 6]);
    expect(Array.from(residualAccurate(a, 2, 3, [1, 1, 1], [6, 16]))).toEqual([0, 1]);
    expect(Array.from(residualAccurate(new Float64Array(0), 2, 0, [], [3, 4]))).toEqual([3, 4]);
    expect(residualAccurate(new Float64Array(0), 0, 3, [1, 2, 3], [])).toHaveLength(0);
  });

  it('rejects bad arguments with a RangeError naming them', () => {
    const a = new Float64Array(6);
    expect(() => residualAccurate(a, -1, 3, [1, 2, 3], [1, 2])).toThrow(/m must be/);
    expect(() => residualAccurate(a, 2, 2.5, [1, 2, 3], [1, 2])).toThrow(/n must be/);
    expect(() => residualAccurate(a, 3, 3, [1, 2, 3], [1, 2, 3])).toThrow(/a must hold/);
    expect(() => residualAccurate(a, 2, 3, [1, 2], [1, 2])).toThrow(/x must have length/);
    expect(() => residualAccurateDoubleDouble(a, 2, 3, [1, 2, 3], [1])).toThrow(
      /b must have length/,
    );
    expect(() => matVecAccurate(a, 2, 3, [1])).toThrow(RangeError);
  });
});

describe('matVecAccurate', () => {
  it('recovers a sum that plain double arithmetic cancels away', () => {
    // 1e16·1 + 1·1 − 1e16·1 = 1 exactly; in double, 1e16 + 1 rounds to 1e16 and the sum is 0.
    const a = Float64Array.from([1e16, 1, -1e16]);
    expect(1e16 + 1 - 1e16).toBe(0);
    expect(Array.from(matVecAccurate(a, 1, 3, [1, 1, 1]))).toEqual([1]);
  });

  it('is within u|y| + γ_n²|A||x| of the exact product; returns +0 for 0', () => {
    const rand = seededUniform(3);
    const m = 6;
    const n = 9;
    const a = Float64Array.from({ length: m * n }, rand);
    const x = Float64Array.from({ length: n }, rand);
    const y = matVecAccurate(a, m, n, x);
    for (let i = 0; i < m; i++) {
      let s: Rational = ZERO;
      let t = 0;
      for (let j = 0; j < n; j++) {
        s = add(s, mul(fromDouble(a[i * n + j]!), fromDouble(x[j]!)));
        t += Math.abs(a[i * n + j]! * x[j]!);
      }
      const err = toNumber(abs(sub(fromDouble(y[i]!), s)));
      expect(err).toBeLessThanOrEqual(u * Math.abs(toNumber(s)) + gamma(n) ** 2 * t * 1.01);
    }
    expect(Object.is(matVecAccurate([1, -1], 1, 2, [1, 1])[0], 0)).toBe(true);
  });
});
