import { describe, expect, it } from 'vitest';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { pivotsOf } from '@tests/helpers/dense-matrix.ts';
import {
  cholesky,
  gepp,
  geppDotProduct,
  ldlt,
  luNoPivot,
  luSolve,
} from '@tests/helpers/factorizations.ts';

/** ‖A − L·U‖₁ evaluated in double for a packed LU without exchanges (GET01 style, references §1.1). */
function factorResidual1(
  a: ArrayLike<number>,
  lu: Float64Array,
  perm: Int32Array,
  n: number,
): number {
  let worst = 0;
  for (let j = 0; j < n; j++) {
    let col = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k <= Math.min(i, j); k++)
        s += (k === i ? 1 : lu[i * n + k]!) * lu[k * n + j]!;
      col += Math.abs(a[perm[i]! * n + j]! - s);
    }
    worst = Math.max(worst, col);
  }
  return worst;
}

describe('needs-row-exchange', () => {
  it('is [[1e-20, 1], [1, 1]] at n = 2: no pivoting gives ratio 2^51 and x = (0, 1), GEPP is exact', () => {
    // References §4.12 and §11 row 39 (b = (1, 2)).
    const a = generateMatrix({ family: 'needs-row-exchange', n: 2 });
    expect(Array.from(a.data)).toEqual([1e-20, 1, 1, 1]);
    const none = luNoPivot(a.data, 2);
    const norm1 = 2;
    expect(factorResidual1(a.data, none.lu, none.perm, 2) / (2 * norm1 * UNIT_ROUNDOFF)).toBe(
      2 ** 51,
    );
    expect(Array.from(luSolve(none, [1, 2], 2))).toEqual([0, 1]);
    const pivoted = gepp(a.data, 2);
    expect(factorResidual1(a.data, pivoted.lu, pivoted.perm, 2)).toBe(0);
    expect(Array.from(luSolve(pivoted, [1, 2], 2))).toEqual([1, 1]);
    expect(a.properties.expectations['lu-no-pivoting']).toBe('factor');
    expect(a.properties.expectations['lu-partial-pivoting']).toBe('factor');
  });

  it('keeps the damage in the leading block at larger n', () => {
    const n = 32;
    const a = generateMatrix({ family: 'needs-row-exchange', n });
    const none = luNoPivot(a.data, n);
    expect(none.zeroPivotAt).toBeUndefined();
    const later = pivotsOf(none.lu, n).slice(2);
    expect(Math.min(...later.map(Math.abs))).toBeGreaterThan(0.5);
    expect(cholesky(a.data, n).failedAt).toBe(1);
    expect(ldlt(a.data, n).zeroPivotAt).toBeUndefined();
    expect(a.properties.expectations.cholesky).toBe('reject');
  });

  it('with pivot 0 or 1 makes LU without pivoting and LDLᵀ meet an exact zero, GEPP not', () => {
    // pivot = 1, n = 3 is [[1,1,0],[1,1,1],[0,1,2]]: singular leading 2×2 minor, det −1, the same
    // situation as [[1,1,1],[1,1,2],[1,2,2]] in references §11 row 38.
    const zero = generateMatrix({ family: 'needs-row-exchange', n: 6, params: { pivot: 0 } });
    expect(luNoPivot(zero.data, 6).zeroPivotAt).toBe(0);
    expect(ldlt(zero.data, 6).zeroPivotAt).toBe(0);
    expect(gepp(zero.data, 6).zeroPivotAt).toBeUndefined();
    const one = generateMatrix({ family: 'needs-row-exchange', n: 3, params: { pivot: 1 } });
    expect(Array.from(one.data)).toEqual([1, 1, 0, 1, 1, 1, 0, 1, 2]);
    expect(luNoPivot(one.data, 3).zeroPivotAt).toBe(1);
    expect(ldlt(one.data, 3).zeroPivotAt).toBe(1);
    const g = gepp(one.data, 3);
    expect(g.zeroPivotAt).toBeUndefined();
    // U = [[1,1,0],[0,1,2],[0,0,1]] after one exchange: det = −1.
    expect(pivotsOf(g.lu, 3)).toEqual([1, 1, 1]);
    expect(Array.from(g.perm)).toEqual([0, 2, 1]);
    for (const m of [zero, one]) {
      expect(m.properties.expectations['lu-no-pivoting']).toBe('reject');
      expect(m.properties.expectations.ldlt).toBe('reject');
      expect(m.properties.expectations['lu-partial-pivoting']).toBe('factor');
    }
    expect(() =>
      generateMatrix({ family: 'needs-row-exchange', n: 2, params: { pivot: 1 } }),
    ).toThrow(/n ≥ 3/);
    expect(() =>
      generateMatrix({ family: 'needs-row-exchange', n: 4, params: { pivot: 0.5 } }),
    ).toThrow(/pivot/);
  });
});

describe('singular', () => {
  it('is [[1, 2], [2, 4]] at n = 2, whose GEPP pivot U₂₂ is exactly 0', () => {
    // References §4.11 and §11 row 35.
    const a = generateMatrix({ family: 'singular', n: 2 });
    expect(Array.from(a.data)).toEqual([1, 2, 2, 4]);
    expect(gepp(a.data, 2).zeroPivotAt).toBe(1);
  });

  it('meets an exact zero pivot under every elimination order and tie rule', () => {
    for (let n = 2; n <= 40; n++) {
      const a = generateMatrix({ family: 'singular', n });
      expect(gepp(a.data, n, 'first').zeroPivotAt).toBeDefined();
      expect(gepp(a.data, n, 'last').zeroPivotAt).toBeDefined();
      expect(geppDotProduct(a.data, n).zeroPivotAt).toBeDefined();
      expect(luNoPivot(a.data, n).zeroPivotAt).toBeDefined();
      expect(a.properties.singular).toBe(true);
      expect(a.properties.exactCondition1).toBeUndefined();
      expect(a.properties.expectations).toEqual({
        'lu-partial-pivoting': 'reject',
        'lu-no-pivoting': 'reject',
        'householder-qr': 'factor',
        'back-substitution': 'reject',
      });
    }
  });
});

describe('nearly-singular', () => {
  it('has no-pivot pivots 1, −3, δ exactly and GEPP last pivot about −δ/2', () => {
    const delta = 2 ** -40;
    const a = generateMatrix({ family: 'nearly-singular', n: 5 });
    expect(pivotsOf(luNoPivot(a.data, 5).lu, 5)).toEqual([1, -3, delta, 1, 1]);
    const last = gepp(a.data, 5).lu[2 * 5 + 2]!;
    expect(Math.abs(last / (-delta / 2) - 1)).toBeLessThan(0.01);
    // κ₁ ≈ 144/δ (‖C‖₁ = 18, ‖C⁻¹‖₁ ≈ 8/δ).
    expect(Math.abs((a.properties.exactCondition1! * delta) / 144 - 1)).toBeLessThan(0.01);
    expect(a.properties.singular).toBe(false);
    expect(a.properties.expectations['lu-partial-pivoting']).toBe('factor');
  });

  it('with δ = 0 is the rank-2 classic, whose GEPP pivot U₃₃ is 2^-53, not 0', () => {
    // References §4.11 and §11 row 36 (order-dependent; right-looking GEPP gives 2^-53).
    const a = generateMatrix({ family: 'nearly-singular', n: 3, params: { delta: 0 } });
    expect(Array.from(a.data)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
    const u33 = gepp(a.data, 3).lu[8]!;
    expect(Math.abs(u33)).toBe(2 ** -53);
    expect(luNoPivot(a.data, 3).zeroPivotAt).toBe(2);
    expect(a.properties.singular).toBe(true);
    expect(a.properties.expectations).toEqual({
      'lu-no-pivoting': 'reject',
      'householder-qr': 'factor',
    });
    expect(() =>
      generateMatrix({ family: 'nearly-singular', n: 3, params: { delta: 1e-12 } }),
    ).toThrow(/delta/);
  });
});

describe('indefinite', () => {
  it('counts the negative pivots of T₁₀ − σI as Sylvester says', () => {
    // References §4.8 and §11 rows 29–30: σ = 1.1 → 3 negative, σ = 3.9 → 9; σ = 2 fails at step 1.
    for (const [sigma, negatives] of [
      [1.1, 3],
      [3.9, 9],
    ] as const) {
      const a = generateMatrix({ family: 'indefinite', n: 10, params: { sigma } });
      const { d, zeroPivotAt } = ldlt(a.data, 10);
      expect(zeroPivotAt).toBeUndefined();
      expect(Array.from(d).filter((x) => x < 0).length).toBe(negatives);
      expect(a.properties.expectations.ldlt).toBe('factor');
      expect(a.properties.expectations.cholesky).toBe('reject');
      expect(cholesky(a.data, 10).failedAt).toBeDefined();
    }
    const t = generateMatrix({ family: 'indefinite', n: 10 });
    expect(t.data[0]).toBe(0);
    expect(ldlt(t.data, 10).zeroPivotAt).toBe(0);
    expect(t.properties.expectations.ldlt).toBe('reject');
    expect(t.properties.expectations['lu-no-pivoting']).toBe('reject');
    expect(t.properties.expectations['lu-partial-pivoting']).toBe('factor');
  });

  it('is singular exactly for σ = 2 and odd n or σ ∈ {1, 3} and 3 | n+1, and GEPP then meets 0', () => {
    for (const sigma of [1, 2, 3]) {
      for (let n = 2; n <= 120; n++) {
        let a;
        try {
          a = generateMatrix({ family: 'indefinite', n, params: { sigma } });
        } catch {
          continue; // σ outside the spectrum for this n (e.g. σ = 1, n = 2)
        }
        const singular = a.properties.singular;
        for (const tie of ['first', 'last'] as const)
          expect(gepp(a.data, n, tie).zeroPivotAt !== undefined).toBe(singular);
        expect(a.properties.expectations['lu-partial-pivoting']).toBe(
          singular ? 'reject' : 'factor',
        );
        expect(a.properties.expectations['back-substitution']).toBe(singular ? 'reject' : 'factor');
        expect(ldlt(a.data, n).zeroPivotAt).toBeDefined();
      }
    }
  });

  it('rejects σ outside the spectrum and n = 1', () => {
    expect(() => generateMatrix({ family: 'indefinite', n: 10, params: { sigma: 0 } })).toThrow(
      /sigma/,
    );
    expect(() => generateMatrix({ family: 'indefinite', n: 10, params: { sigma: 4.5 } })).toThrow(
      /sigma/,
    );
    expect(() => generateMatrix({ family: 'indefinite', n: 1 })).toThrow(/n ≥ 2/);
  });
});
