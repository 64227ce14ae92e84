import { describe, expect, it } from 'vitest';
import {
  GEPP_PANEL_WIDTH,
  luFactorPartialPivoting,
  luFactorPartialPivotingUnblocked,
  type GeppResult,
} from '@sandbox/reference/gepp.ts';
import { randomMatrix, worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

// The blocked GEPP (DGETRF's shape) must return what the plain right-looking loop returns: the
// same operations per entry in the same order, so equality is exact (===; only the sign of a
// zero may differ). Sizes straddle the panel width and its multiples, where the blocked code
// changes path (numerics-references §10: sweep block boundaries, cf. LAPACK's NB sweep).
function expectSame(a: Float64Array, n: number): GeppResult {
  const blocked = luFactorPartialPivoting(a, n);
  const plain = luFactorPartialPivotingUnblocked(a, n);
  expect(blocked.ok).toBe(plain.ok);
  if (blocked.ok && plain.ok) {
    expect(Array.from(blocked.perm)).toEqual(Array.from(plain.perm));
    let differing = 0;
    for (let k = 0; k < n * n; k++) {
      const x = blocked.lu[k]!;
      const y = plain.lu[k]!;
      if (!(x === y || (Number.isNaN(x) && Number.isNaN(y)))) differing++;
    }
    expect(differing).toBe(0);
  } else if (!blocked.ok && !plain.ok) {
    expect(blocked.column).toBe(plain.column);
  }
  return blocked;
}

describe('luFactorPartialPivoting (blocked) against the plain loop', () => {
  const nb = GEPP_PANEL_WIDTH;
  const sizes = [1, 2, 3, nb - 1, nb, nb + 1, 2 * nb + 3, 3 * nb + 2, 150];

  it('returns identical factors and permutation on random matrices at every block boundary', () => {
    for (const [index, n] of sizes.entries()) {
      const f = expectSame(randomMatrix(n, n, 100 + index), n);
      expect(f.ok).toBe(true);
    }
  });

  it('keeps the first-maximum tie rule across panels: worst-growth matrix, growth 2^(n−1)', () => {
    // Higham, ASNA 2nd ed., §9.4 (from memory); numerics-references §11 row 7: with first-max
    // ties there are no row swaps and u_nn = 2^(n−1), exact in double.
    const n = 2 * nb + 5;
    const f = expectSame(worstGrowthMatrix(n), n);
    if (!f.ok) throw new Error('unexpected zero pivot');
    expect(Array.from(f.perm)).toEqual(Array.from({ length: n }, (_, i) => i));
    expect(f.lu[n * n - 1]).toBe(2 ** (n - 1));
  });

  it('stops at the same exactly zero pivot, in a later panel', () => {
    // Rows nb+3 and nb+4 of an integer matrix made equal: rank deficiency appears as an exact
    // zero pivot only if both routines eliminate identically; either way they must agree.
    const n = 2 * nb;
    const a = randomMatrix(n, n, 7).map((v) => Math.round(v * 8));
    for (let j = 0; j < n; j++) a[(nb + 4) * n + j] = a[(nb + 3) * n + j]!;
    for (let i = 0; i < n; i++) a[i * n + n - 1] = a[i * n + n - 2]!; // two equal columns too
    const f = expectSame(a, n);
    expect(f.ok).toBe(false);
  });

  it('stops at an exactly zero pivot inside either half of the recursive panel', () => {
    // The panel is factored by halves down to a few columns; a zero pivot in any piece must end
    // the whole factorisation at the same column as the plain loop. The rows of an upper
    // triangular matrix with u_cc = 0, shuffled: every multiplier is exactly 0 (one nonzero per
    // column among the rows not yet used), rows are swapped back into place, and column c has
    // no nonzero left at step c, so the first zero pivot is exactly at c.
    const n = nb + 9;
    for (const c of [1, 3, 4, 5, 9, 15, 16, 17, 24, nb - 1, nb + 2]) {
      const u = randomMatrix(n, n, 40 + c);
      for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) u[i * n + j] = 0;
      u[c * n + c] = 0;
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        const from = (i * 7 + c) % n; // 7 is prime to n = 41, so this is a permutation
        a.set(u.subarray(from * n, from * n + n), i * n);
      }
      const f = expectSame(a, n);
      expect(f.ok).toBe(false);
      if (!f.ok) expect(f.column).toBe(c);
    }
  });

  it('falls back to the plain loop on non-finite input, so NaN and Inf propagate alike', () => {
    const n = nb + 7;
    const a = randomMatrix(n, n, 9);
    a[5 * n + 40] = Infinity;
    a[20 * n + 3] = Number.NaN;
    expectSame(a, n);
  });

  it('agrees where growth overflows to Inf (the result check sends it to the plain loop)', () => {
    // Entries near the overflow threshold with the worst-growth pattern: the trailing column
    // doubles at each step and overflows after a few panels.
    const n = 3 * nb;
    const a = worstGrowthMatrix(n).map((v) => v * 2 ** 1000);
    const f = expectSame(a, n);
    if (f.ok) expect(f.lu.some((v) => !Number.isFinite(v))).toBe(true);
  });
});
