import { describe, expect, it } from 'vitest';
import { norm1 } from '@sandbox/numerics/norms.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import {
  CHOLESKY_PANEL_WIDTH,
  choleskyFactor,
  choleskyFactorUnblocked,
} from '@sandbox/reference/cholesky.ts';
import { matmul, transpose } from '@tests/helpers/dense-matrix.ts';
import { randomSpd } from '@tests/helpers/test-matrices.ts';

function factorOk(a: Float64Array, n: number): Float64Array {
  const f = choleskyFactor(a, n);
  if (!f.ok) throw new Error(`not positive definite at column ${f.column}`);
  return f.l;
}

function binomial(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n - k + i)) / i;
  return Math.round(c);
}

describe('choleskyFactor', () => {
  it('Pascal P_n, n ≤ 29: L is the lower Pascal matrix of binomials, bit for bit', () => {
    // Higham's Test Matrix Toolbox, pascal.m ("PASCAL(N,1) is the lower triangular Cholesky
    // factor"); numerics-references §11 row 19: every intermediate is an integer ≤ p_ij < 2^53
    // for n ≤ 29, so any summation order is exact.
    for (const n of [5, 16, 29]) {
      const p = Float64Array.from({ length: n * n }, (_, k) =>
        binomial(Math.floor(k / n) + (k % n), Math.floor(k / n)),
      );
      const l = factorOk(p, n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) expect(l[i * n + j]).toBe(j <= i ? binomial(i, j) : 0);
    }
  });

  it('minij(n): L is the lower triangle of ones, exactly', () => {
    // minij.m in Higham's toolbox; numerics-references §11 row 21 (a_ij = min(i, j), 1-based).
    const n = 2 * CHOLESKY_PANEL_WIDTH + 3;
    const a = Float64Array.from(
      { length: n * n },
      (_, k) => Math.min(Math.floor(k / n), k % n) + 1,
    );
    const l = factorOk(a, n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) expect(l[i * n + j]).toBe(j <= i ? 1 : 0);
  });

  it('is bit-for-bit the unblocked right-looking loop across block boundaries', () => {
    const nb = CHOLESKY_PANEL_WIDTH;
    for (const [index, n] of [1, 2, nb - 1, nb, nb + 1, 2 * nb + 1, 2 * nb + 2, 100].entries()) {
      const a = randomSpd(n, 40 + index);
      const blocked = choleskyFactor(a, n);
      const plain = choleskyFactorUnblocked(a, n);
      if (!blocked.ok || !plain.ok) throw new Error('unexpected failure');
      let differing = 0;
      for (let k = 0; k < n * n; k++) if (blocked.l[k] !== plain.l[k]) differing++;
      expect(differing).toBe(0);
    }
  });

  it('meets the factor-ratio threshold on random SPD matrices (LAPACK dpot01, < 30)', () => {
    // ‖A − LLᵀ‖₁ / (n‖A‖₁u) < 30: LAPACK TESTING dpot01 and dtest.in (numerics.md, Metrics).
    // The product is formed in double here; for these well-conditioned matrices its own
    // rounding is a few units of n‖A‖u, far below the threshold.
    for (const n of [50, 97]) {
      const a = randomSpd(n, n);
      const l = factorOk(a, n);
      const llt = matmul(l, transpose(l, n, n), n, n, n);
      const ratio =
        norm1(
          a.map((v, k) => v - llt[k]!),
          n,
          n,
        ) /
        (n * norm1(a, n, n) * UNIT_ROUNDOFF);
      expect(ratio).toBeLessThan(30);
    }
  });

  it('reports the first column whose pivot is not positive', () => {
    // [[1,2],[2,1]] is indefinite (eigenvalues 3 and −1): the second pivot is 1 − 4 = −3.
    const f = choleskyFactor(Float64Array.from([1, 2, 2, 1]), 2);
    expect(f).toEqual({ ok: false, reason: 'not-positive-definite', column: 1 });
    // A zero leading entry fails at column 0; a failure in a later panel is found there too.
    expect(choleskyFactor(Float64Array.from([0, 0, 0, 1]), 2)).toMatchObject({ column: 0 });
    const n = CHOLESKY_PANEL_WIDTH + 5;
    const a = randomSpd(n, 3);
    a[(n - 2) * n + (n - 2)] = -1;
    expect(choleskyFactor(a, n)).toMatchObject({ ok: false, column: n - 2 });
  });

  it('reads only the lower triangle and does not mutate its input; rejects bad arguments', () => {
    const a = Float64Array.from([4, 99, 2, 5]); // upper entry 99 is ignored
    expect(Array.from(factorOk(a, 2))).toEqual([2, 0, 1, 2]);
    expect(Array.from(a)).toEqual([4, 99, 2, 5]);
    expect(() => choleskyFactor(new Float64Array(3), 2)).toThrow(RangeError);
    expect(() => choleskyFactor(Float64Array.from([Number.NaN]), 1)).toThrow(/finite/);
  });
});
