import { describe, expect, it } from 'vitest';
import { residualDot2, residualDot3 } from '@sandbox/metrics/accurate-product.ts';
import { fromDouble, mul, sub, sum, toNumber } from '@tests/helpers/rational.ts';
import { seededUniform } from '@tests/helpers/seeded-random.ts';

/** c − Σ x_k·y_k (·d_k) exactly, rounded once at the end. */
function exactResidual(c: number, x: number[], y: number[], d?: number[]): number {
  const terms = x.map((xk, k) => {
    const p = mul(fromDouble(xk), fromDouble(y[k]!));
    return d ? mul(p, fromDouble(d[k]!)) : p;
  });
  return toNumber(sub(fromDouble(c), sum(terms)));
}

describe('residualDot2', () => {
  it('recovers a residual that cancels completely in double', () => {
    // Hand: 1 − (1e16·1e16 − 1e32 …): with x = (2^60, 1, −2^60), y = (1, 1, 1) and c = 0 the
    // true value is −1, while the plain sum gives 0 (1 is lost next to 2^60).
    const x = [2 ** 60, 1, -(2 ** 60)];
    const y = [1, 1, 1];
    const plain = -(x[0]! * y[0]! + x[1]! * y[1]! + x[2]! * y[2]!);
    expect(plain).toBe(-0);
    expect(residualDot2(0, 0, 3, x, 0, 1, y, 0, 1)).toBe(-1);
  });

  it('agrees with exact rational arithmetic on ill-conditioned random data (Ogita–Rump–Oishi Dot2)', () => {
    // Dot2's error is at most u·|result| + γ_n²·Σ|terms| (ORO 2005, from memory); the data are
    // built so that c cancels the sum to about 1e-12 of the terms' size.
    const next = seededUniform(42);
    for (let trial = 0; trial < 20; trial++) {
      const n = 30;
      const x = Array.from({ length: n }, () => next() * 2 ** Math.round(next() * 30));
      const y = Array.from({ length: n }, () => next());
      const c = x.reduce((s, xk, k) => s + xk * y[k]!, 0);
      const want = exactResidual(c, x, y);
      const got = residualDot2(c, 0, n, x, 0, 1, y, 0, 1);
      const scale = x.reduce((s, xk, k) => s + Math.abs(xk * y[k]!), Math.abs(c));
      expect(Math.abs(got - want)).toBeLessThanOrEqual(2 ** -53 * Math.abs(want) + 1e-28 * scale);
    }
  });

  it('reads strided vectors and adds the low part of the constant', () => {
    // Row 1 of a 2×3 matrix against column 2 of a 3×2 matrix; hand value 10 − (4·2 + 5·4 + 6·6) = −54.
    const a = [1, 2, 3, 4, 5, 6];
    const b = [1, 2, 3, 4, 5, 6];
    expect(residualDot2(10, 0, 3, a, 3, 1, b, 1, 2)).toBe(-54);
    expect(residualDot2(1, 2 ** -60, 0, a, 0, 1, b, 0, 1)).toBe(1); // 1 + 2^-60 rounds to 1
    expect(Number.isNaN(residualDot2(0, 0, 1, [Infinity], 0, 1, [1], 0, 1))).toBe(true);
  });
});

describe('residualDot3', () => {
  it('matches exact rationals for c − Σ x_k·d_k·y_k', () => {
    const next = seededUniform(7);
    for (let trial = 0; trial < 20; trial++) {
      const n = 10;
      const x = Array.from({ length: n }, next);
      const d = Array.from({ length: n }, () => next() * 1e3);
      const y = Array.from({ length: n }, next);
      const c = x.reduce((s, xk, k) => s + xk * d[k]! * y[k]!, 0);
      const want = exactResidual(c, x, y, d);
      const got = residualDot3(c, n, x, 0, 1, d, 0, y, 0, 1);
      expect(Math.abs(got - want)).toBeLessThanOrEqual(2 ** -53 * Math.abs(want) + 1e-25);
    }
  });
});
