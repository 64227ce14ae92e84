import { describe, expect, it } from 'vitest';
import { flopCount, gflops } from '@sandbox/timing/flops.ts';

// Leading-term flop counts, Golub & Van Loan, Matrix Computations, 4th ed., §3.1, 3.2, 4.1, 4.2,
// 5.2 (from memory); n = 1000 values as in numerics-references §11 row 53 and §9.
describe('flopCount', () => {
  it('n = 1000: LU 6.667e8, Cholesky and LDLᵀ 3.333e8, QR 1.333e9, triangular solve 1e6', () => {
    expect(flopCount('lu-partial-pivoting', 1000, 1000)).toBeCloseTo(2e9 / 3, 3);
    expect(flopCount('lu-no-pivoting', 1000, 1000)).toBeCloseTo(2e9 / 3, 3);
    expect(flopCount('cholesky', 1000, 1000)).toBeCloseTo(1e9 / 3, 3);
    expect(flopCount('ldlt', 1000, 1000)).toBeCloseTo(1e9 / 3, 3);
    expect(flopCount('householder-qr', 1000, 1000)).toBeCloseTo(4e9 / 3, 3);
    expect(flopCount('back-substitution', 1000, 1000)).toBe(1e6);
  });

  it('rectangular QR: 2mn² − 2n³/3 = 3 333 333 333 for 2000 × 1000 (§9)', () => {
    expect(Math.round(flopCount('householder-qr', 2000, 1000))).toBe(3333333333);
  });

  it('rejects m ≠ n for square routines, m < n for QR and non-integer sizes', () => {
    expect(() => flopCount('cholesky', 3, 4)).toThrow(/m must equal n/);
    expect(() => flopCount('householder-qr', 3, 4)).toThrow(/at least n/);
    expect(() => flopCount('ldlt', 2.5, 2.5)).toThrow(/m must be/);
  });
});

describe('gflops', () => {
  it('is flops / (ms · 10⁶)', () => {
    // LU at n = 1000 in 1 s: 6.667e8 flops/s = 0.6667 GFLOP/s.
    expect(gflops('lu-partial-pivoting', 1000, 1000, 1000)).toBeCloseTo(2 / 3, 12);
    // Back substitution at n = 1000 in 1 ms: 1e6 flops in 1e-3 s = 1 GFLOP/s.
    expect(gflops('back-substitution', 1000, 1000, 1)).toBeCloseTo(1, 12);
  });

  it('rejects a non-positive or non-finite time', () => {
    expect(() => gflops('cholesky', 10, 10, 0)).toThrow(/ms must be/);
    expect(() => gflops('cholesky', 10, 10, NaN)).toThrow(RangeError);
  });
});
