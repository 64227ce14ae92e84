import { describe, expect, it } from 'vitest';
import { norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  QR_PANEL_WIDTH,
  householderQr,
  householderQrUnblocked,
  householderR,
  householderThinQ,
} from '@sandbox/reference/householder-qr.ts';
import { matmul, transpose } from '@tests/helpers/dense-matrix.ts';
import { randomMatrix } from '@tests/helpers/test-matrices.ts';

function ratios(a: Float64Array, m: number, n: number) {
  const f = householderQr(a, m, n);
  const q = householderThinQ(f, m, n);
  const r = householderR(f, n);
  const qr = matmul(q, r, m, n, n);
  const qtq = matmul(transpose(q, m, n), q, n, m, n);
  const factor =
    norm1(
      a.map((v, k) => v - qr[k]!),
      m,
      n,
    ) /
    (m * norm1(a, m, n) * UNIT_ROUNDOFF);
  const orth =
    norm1(
      qtq.map((v, k) => (k % (n + 1) === 0 ? 1 : 0) - v),
      n,
      n,
    ) /
    (m * UNIT_ROUNDOFF);
  return { factor, orth, f, r };
}

describe('householderQr', () => {
  it('a 2×1 column (3, 4): β = −5, τ = 1.6, v = (1, 0.5), exactly (DLARFG convention)', () => {
    // LAPACK DLARFG: β = −sign(α)·‖x‖₂ = −5, τ = (β − α)/β = 8/5, v₂ = 4/(α − β) = 1/2
    // (computed by hand; 1.6 is the double nearest 8/5, which (β − α)/β rounds to).
    const f = householderQr(Float64Array.from([3, 4]), 2, 1);
    expect(Array.from(f.qr)).toEqual([-5, 0.5]);
    expect(f.tau[0]).toBe(1.6);
  });

  it('leaves a zero column alone: τ = 0 (H = I)', () => {
    const f = householderQr(Float64Array.from([0, 1, 0, 2]), 2, 2);
    expect(f.tau[0]).toBe(0);
    expect(f.qr[0]).toBe(0);
  });

  it('[[1,2],[2,4],[3,6]] (rank 1): |r₂₂| ≤ 10u‖A‖₂', () => {
    // numerics-references §11 row 40 (computed there: |R₂₂| ≈ 2e-15); ‖A‖₂ = √70 exactly
    // for this rank-one matrix (√(1+4+9)·√(1+4)).
    const { r } = ratios(Float64Array.from([1, 2, 2, 4, 3, 6]), 3, 2);
    expect(Math.abs(r[3]!)).toBeLessThanOrEqual(10 * UNIT_ROUNDOFF * Math.sqrt(70));
    expect(Math.abs(r[0]!)).toBeCloseTo(Math.sqrt(14), 14);
  });

  it('meets LAPACK dqrt01/dqrt02 thresholds (< 30) across block boundaries, square and tall', () => {
    // ‖A − QR‖₁/(m‖A‖₁u) and ‖I − QᵀQ‖₁/(m u), pass below 30 (LAPACK TESTING dqrt01, dtest.in;
    // numerics.md, Metrics). Typical values for uniform matrices are below 1 (§11 row 4).
    const nb = QR_PANEL_WIDTH;
    const shapes: [number, number][] = [
      [nb - 1, nb - 1],
      [nb + 1, nb + 1],
      [2 * nb + 3, 2 * nb + 3],
      [150, 2 * nb + 5],
      [100, 100],
    ];
    for (const [index, [m, n]] of shapes.entries()) {
      const { factor, orth } = ratios(randomMatrix(m, n, 60 + index), m, n);
      expect(factor).toBeLessThan(30);
      expect(orth).toBeLessThan(30);
    }
  });

  it('agrees with the unblocked loop to rounding (same reflectors and R)', () => {
    const m = 130;
    const n = 3 * QR_PANEL_WIDTH + 1;
    const a = randomMatrix(m, n, 5);
    const blocked = householderQr(a, m, n);
    const plain = householderQrUnblocked(a, m, n);
    let worst = 0;
    for (let k = 0; k < m * n; k++)
      worst = Math.max(worst, Math.abs(blocked.qr[k]! - plain.qr[k]!));
    // Entries are O(√m) at most; a difference of 1e3·u·m in them is rounding, a wrong
    // reflector or a wrong T would differ by O(1) (common practice).
    expect(worst).toBeLessThan(1e3 * m * UNIT_ROUNDOFF);
    for (let k = 0; k < n; k++) expect(blocked.tau[k]).toBeCloseTo(plain.tau[k]!, 12);
  });

  it('does not mutate its input and rejects bad arguments', () => {
    const a = randomMatrix(6, 4, 1);
    const copy = Float64Array.from(a);
    householderQr(a, 6, 4);
    expect(Array.from(a)).toEqual(Array.from(copy));
    expect(() => householderQr(new Float64Array(6), 2, 3)).toThrow(RangeError);
    expect(() => householderQr(Float64Array.from([Infinity]), 1, 1)).toThrow(/finite/);
  });
});
