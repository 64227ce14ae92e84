import { describe, expect, it } from 'vitest';
import { orthogonalityRatio } from '@sandbox/metrics/orthogonality.ts';
import {
  type Rational,
  abs,
  div,
  fromDouble,
  max,
  mul,
  rational,
  sub,
  sum,
  toNumber,
  UNIT_ROUNDOFF_EXACT,
  ZERO,
} from '@tests/helpers/rational.ts';
import { hadamard4 } from '@tests/helpers/test-matrices.ts';

/** ‖I − QᵀQ‖₁ / (max(1, m)·u) in exact rationals (LAPACK dqrt01/dqrt02 formula). */
function exactOrthogonality(q: ArrayLike<number>, m: number, n: number): number {
  const e: Rational[] = [];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      const dot = sum(
        Array.from({ length: m }, (_, k) =>
          mul(fromDouble(q[k * n + i]!), fromDouble(q[k * n + j]!)),
        ),
      );
      e.push(sub(rational(i === j ? 1n : 0n), dot));
    }
  let norm = ZERO;
  for (let j = 0; j < n; j++)
    norm = max(norm, sum(Array.from({ length: n }, (_, i) => abs(e[i * n + j]!))));
  return toNumber(div(norm, mul(rational(BigInt(Math.max(1, m))), UNIT_ROUNDOFF_EXACT)));
}

const H = hadamard4();

describe('orthogonalityRatio', () => {
  it('is 0 for exactly orthogonal Q: permutation, Hadamard, thin columns', () => {
    // Exactly orthonormal columns in binary arithmetic, so I − QᵀQ = 0 exactly.
    const perm = Float64Array.of(0, 1, 0, 0, 0, 0, 0, 1, 1, 0, 0, 0, 0, 0, 1, 0);
    expect(orthogonalityRatio(perm, 4, 4)).toBe(0);
    expect(orthogonalityRatio(H, 4, 4)).toBe(0);
    const thin = Float64Array.from(
      { length: 12 },
      (_, k) => H[Math.floor(k / 3) * 4 + (k % 3) + 1]!,
    );
    expect(orthogonalityRatio(thin, 4, 3)).toBe(0);
    expect(orthogonalityRatio(new Float64Array(0), 0, 0)).toBe(0);
  });

  it('measures only the rounding of 3/5 and 4/5 for a 3-4-5 Givens rotation', () => {
    // c = 3/5, s = 4/5 are not binary fractions; the doubles fl(0.6), fl(0.8) give
    // I − QᵀQ = diag(1 − c² − s²) exactly, so the ratio is |1 − c² − s²|/(2u) (hand derivation,
    // checked here with BigInt rationals); it must be well below 1.
    const g = Float64Array.of(0.6, -0.8, 0.8, 0.6);
    const c = fromDouble(0.6);
    const s = fromDouble(0.8);
    const byHand = toNumber(
      div(
        abs(sub(rational(1n), sum([mul(c, c), mul(s, s)]))),
        mul(rational(2n), UNIT_ROUNDOFF_EXACT),
      ),
    );
    expect(exactOrthogonality(g, 2, 2)).toBe(byHand);
    expect(byHand).toBeLessThan(1);
    const got = orthogonalityRatio(g, 2, 2);
    expect(Math.abs(got - byHand)).toBeLessThanOrEqual(1e-14 * byHand + 1e-30);
  });

  it('matches the exact ratio for a perturbed Q', () => {
    const q = Float64Array.from(H);
    q[0] = 0.5 + 2 ** -30;
    q[6] = -0.5 + 1e-9;
    const want = exactOrthogonality(q, 4, 4);
    expect(want).toBeGreaterThan(1e6);
    expect(Math.abs(orthogonalityRatio(q, 4, 4) - want) / want).toBeLessThan(1e-13);
  });

  it('is Infinity, never NaN, for non-finite or overflowing entries', () => {
    for (const bad of [NaN, Infinity, 1e308]) {
      const q = Float64Array.from(H);
      q[5] = bad;
      expect(orthogonalityRatio(q, 4, 4)).toBe(Infinity);
    }
    expect(() => orthogonalityRatio(H, 4, 3)).toThrow(RangeError);
  });
});
