import { describe, expect, it } from 'vitest';
import {
  componentwiseBackwardError,
  normwiseBackwardError,
  solveResidualRatio,
} from '@sandbox/metrics/backward-error.ts';
import { scaledSolveResidual } from '@sandbox/metrics/solve-residual.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  type Rational,
  abs,
  add,
  div,
  fromDouble,
  max,
  mul,
  sub,
  sum,
  toNumber,
  UNIT_ROUNDOFF_EXACT,
  ZERO,
} from '@tests/helpers/rational.ts';

/** η, ω and the dget02 ratio of (A, x, b) in exact rationals, from their definitions. */
function exactErrors(a: ArrayLike<number>, n: number, x: ArrayLike<number>, b: ArrayLike<number>) {
  const A = Array.from(a, fromDouble);
  const X = Array.from(x, fromDouble);
  const B = Array.from(b, fromDouble);
  const r: Rational[] = [];
  let omega = ZERO;
  for (let i = 0; i < n; i++) {
    const row = Array.from({ length: n }, (_, j) => A[i * n + j]!);
    r.push(sub(B[i]!, sum(row.map((v, j) => mul(v, X[j]!)))));
    const den = add(sum(row.map((v, j) => mul(abs(v), abs(X[j]!)))), abs(B[i]!));
    omega = max(omega, div(abs(r[i]!), den));
  }
  const normInfVec = (v: Rational[]) => v.reduce((m, e) => max(m, abs(e)), ZERO);
  const norm1Vec = (v: Rational[]) => sum(v.map(abs));
  let normInfA = ZERO;
  let norm1A = ZERO;
  for (let i = 0; i < n; i++) {
    normInfA = max(normInfA, norm1Vec(A.slice(i * n, i * n + n)));
    norm1A = max(norm1A, norm1Vec(Array.from({ length: n }, (_, k) => A[k * n + i]!)));
  }
  const eta = div(normInfVec(r), add(mul(normInfA, normInfVec(X)), normInfVec(B)));
  const ratio = div(norm1Vec(r), mul(mul(norm1A, norm1Vec(X)), UNIT_ROUNDOFF_EXACT));
  return { eta: toNumber(eta), omega: toNumber(omega), ratio: toNumber(ratio) };
}

function relErr(got: number, want: number): number {
  return Math.abs(got - want) / Math.abs(want);
}

describe('backward errors of a computed solution', () => {
  it('match hand values on a 2×2 system', () => {
    // Hand computation: A = [[2,1],[1,3]], b = (3,4), x̂ = (1, 1.5): r = (−0.5, −1.5).
    // Rigal–Gaches (numerics-references §2.1): η = 1.5/(4·1.5 + 4) = 0.15.
    // Oettli–Prager (§2.2): ω = max(0.5/6.5, 1.5/9.5) = 3/19.
    // LAPACK dget02 (§1.1): ‖r‖₁/(‖A‖₁‖x̂‖₁u) = 2/(4·2.5·u) = 0.2/u.
    const a = Float64Array.of(2, 1, 1, 3);
    const x = Float64Array.of(1, 1.5);
    const b = Float64Array.of(3, 4);
    expect(relErr(normwiseBackwardError(a, 2, x, b), 0.15)).toBeLessThan(1e-15);
    expect(relErr(componentwiseBackwardError(a, 2, x, b), 3 / 19)).toBeLessThan(1e-15);
    expect(relErr(solveResidualRatio(a, 2, x, b), 0.2 / UNIT_ROUNDOFF)).toBeLessThan(1e-15);
  });

  it('match hand values on a 3×3 system with a 0/0 row', () => {
    // Hand: A = diag(1, 2, 0), x̂ = (1, 1, 5), b = (1, 2.5, 0): r = (0, 0.5, 0); row 3 is 0/0 := 0.
    // ω = 0.5/(2 + 2.5) = 1/9; η = 0.5/(2·5 + 2.5) = 0.04; dget02 = 0.5/(2·7·u).
    const a = Float64Array.of(1, 0, 0, 0, 2, 0, 0, 0, 0);
    const x = Float64Array.of(1, 1, 5);
    const b = Float64Array.of(1, 2.5, 0);
    expect(relErr(componentwiseBackwardError(a, 3, x, b), 1 / 9)).toBeLessThan(1e-15);
    expect(relErr(normwiseBackwardError(a, 3, x, b), 0.04)).toBeLessThan(1e-15);
    expect(relErr(solveResidualRatio(a, 3, x, b), 0.5 / (14 * UNIT_ROUNDOFF))).toBeLessThan(1e-15);
  });

  it('use an accurate residual: tiny residuals of decimal data match exact rationals', () => {
    // b = fl(A·x̂) in double, so the true residual is a few rounding errors, which a double
    // evaluation of b − Ax̂ would distort. Check values from the definitions in BigInt rationals.
    const a = Float64Array.of(0.1, 0.2, 0.7, 0.3, 0.4, 0.9, 1 / 3, 0.6, 0.15);
    const x = Float64Array.of(1 / 3, 2 / 3, -0.7);
    const b = Float64Array.from(
      [0, 1, 2],
      (i) => a[3 * i]! * x[0]! + a[3 * i + 1]! * x[1]! + a[3 * i + 2]! * x[2]!,
    );
    const want = exactErrors(a, 3, x, b);
    expect(want.omega).toBeGreaterThan(0);
    expect(relErr(normwiseBackwardError(a, 3, x, b), want.eta)).toBeLessThan(1e-13);
    expect(relErr(componentwiseBackwardError(a, 3, x, b), want.omega)).toBeLessThan(1e-13);
    expect(relErr(solveResidualRatio(a, 3, x, b), want.ratio)).toBeLessThan(1e-13);
  });

  it('are unchanged when A, x̂ and b are scaled by powers of two near the ends of the range', () => {
    const a = Float64Array.of(2, 1, 1, 3);
    const x = Float64Array.of(1, 1.5);
    const b = Float64Array.of(3, 4);
    const as = a.map((v) => v * 2 ** -600);
    const xs = x.map((v) => v * 2 ** 1000);
    const bs = b.map((v) => v * 2 ** 400);
    expect(normwiseBackwardError(as, 2, xs, bs)).toBe(normwiseBackwardError(a, 2, x, b));
    expect(componentwiseBackwardError(as, 2, xs, bs)).toBe(componentwiseBackwardError(a, 2, x, b));
    expect(solveResidualRatio(as, 2, xs, bs)).toBe(solveResidualRatio(a, 2, x, b));
  });

  it('follow the degenerate-case conventions', () => {
    // n = 0: dget02's quick exit gives 0; η and ω are 0/0 := 0.
    const e = new Float64Array(0);
    expect([
      normwiseBackwardError(e, 0, e, e),
      componentwiseBackwardError(e, 0, e, e),
      solveResidualRatio(e, 0, e, e),
    ]).toEqual([0, 0, 0]);
    // A = 0, x̂ = (1, 1), b = (1, 0): dget02 gives 1/EPS for ‖A‖₁ = 0; η = 1/1; ω = max(1/1, 0/0).
    const zero = new Float64Array(4);
    expect(solveResidualRatio(zero, 2, Float64Array.of(1, 1), Float64Array.of(1, 0))).toBe(2 ** 53);
    expect(normwiseBackwardError(zero, 2, Float64Array.of(1, 1), Float64Array.of(1, 0))).toBe(1);
    expect(componentwiseBackwardError(zero, 2, Float64Array.of(1, 1), Float64Array.of(1, 0))).toBe(
      1,
    );
    // x̂ = 0 with b ≠ 0: dget02 gives 1/EPS for ‖x‖₁ = 0. An exact solution scores 0.
    const a = Float64Array.of(2, 1, 1, 3);
    expect(solveResidualRatio(a, 2, Float64Array.of(0, 0), Float64Array.of(3, 4))).toBe(2 ** 53);
    expect(solveResidualRatio(a, 2, Float64Array.of(1, 1), Float64Array.of(3, 4))).toBe(0);
    expect(normwiseBackwardError(a, 2, Float64Array.of(1, 1), Float64Array.of(3, 4))).toBe(0);
  });

  it('are Infinity for non-finite x̂ and never NaN for huge x̂', () => {
    const a = Float64Array.of(2, 1, 1, 3);
    const b = Float64Array.of(3, 4);
    for (const bad of [NaN, Infinity, -Infinity]) {
      const x = Float64Array.of(1, bad);
      const s = scaledSolveResidual(a, 2, x, b);
      expect(normwiseBackwardError(a, 2, x, b, s)).toBe(Infinity);
      expect(componentwiseBackwardError(a, 2, x, b, s)).toBe(Infinity);
      expect(solveResidualRatio(a, 2, x, b, s)).toBe(Infinity);
    }
    const x = Float64Array.of(1e308, -1e308);
    for (const v of [
      normwiseBackwardError(a, 2, x, b),
      componentwiseBackwardError(a, 2, x, b),
      solveResidualRatio(a, 2, x, b),
    ]) {
      expect(Number.isNaN(v)).toBe(false);
      expect(v).toBeGreaterThan(0.4); // η ≈ 2e308/4e308 by hand; ω and dget02 larger
    }
    expect(() => normwiseBackwardError(a, 2, Float64Array.of(1), b)).toThrow(RangeError);
  });
});
