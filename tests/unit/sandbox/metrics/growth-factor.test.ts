import { describe, expect, it } from 'vitest';
import { ldltGrowthFactor, luGrowthFactor } from '@sandbox/metrics/growth-factor.ts';
import { gepp, luNoPivot } from '@tests/helpers/factorizations.ts';
import { worstGrowthMatrix } from '@tests/helpers/test-matrices.ts';

describe('luGrowthFactor', () => {
  it('is 2^(n−1) for the worst-growth matrix under GEPP with the first-maximum tie rule', () => {
    // numerics-references §3 and §11 row 7: 512 (n = 10), 524288 (n = 20), 2^59 (n = 60);
    // Wilkinson's bound ρ_n ≤ 2^(n−1) is attained (Higham, ASNA 2nd ed., §9.4, from memory).
    for (const n of [2, 10, 20, 60]) {
      const a = worstGrowthMatrix(n);
      expect(luGrowthFactor(a, n, gepp(a, n, 'first').lu)).toBe(2 ** (n - 1));
    }
  });

  it('is 2 for the same matrix when ties pick the last maximum', () => {
    // numerics-references §3 and §11 row 8.
    for (const n of [10, 60]) {
      const a = worstGrowthMatrix(n);
      expect(luGrowthFactor(a, n, gepp(a, n, 'last').lu)).toBe(2);
    }
  });

  it('is 1.5^(n−1) for the α = 0.5 variant under any tie rule', () => {
    // numerics-references §3 fact 2 and §11 row 9: 38.443359375 (n = 10), 127834.03948858939 (n = 30).
    expect(
      luGrowthFactor(worstGrowthMatrix(10, 0.5), 10, gepp(worstGrowthMatrix(10, 0.5), 10).lu),
    ).toBe(38.443359375);
    const a = worstGrowthMatrix(30, 0.5);
    expect(luGrowthFactor(a, 30, gepp(a, 30, 'last').lu)).toBe(127834.03948858939);
  });

  it('reads only the upper triangle, and handles zero and non-finite data', () => {
    // Hand value: A = [[1e-20, 1], [1, 1]] without pivoting has U = [[1e-20, 1], [0, 1 − 1e20]],
    // so max|U| / max|A| = fl(1 − 1e20) in magnitude = 1e20 (numerics-references §4.12).
    const a = Float64Array.of(1e-20, 1, 1, 1);
    expect(luGrowthFactor(a, 2, luNoPivot(a, 2).lu)).toBe(1e20);
    expect(luGrowthFactor(Float64Array.of(2, 0, 0, 4), 2, Float64Array.of(2, 0, 1e9, 4))).toBe(1);
    // Conventions of growth-factor.ts: 0/0 := 1, nonzero/0 := ∞, NaN := ∞.
    expect(luGrowthFactor(new Float64Array(4), 2, new Float64Array(4))).toBe(1);
    expect(luGrowthFactor(new Float64Array(4), 2, Float64Array.of(0, 1, 0, 0))).toBe(Infinity);
    expect(luGrowthFactor(Float64Array.of(1, 0, 0, 1), 2, Float64Array.of(1, NaN, 0, 1))).toBe(
      Infinity,
    );
    expect(
      luGrowthFactor(Float64Array.of(1, 0, 0, 1), 2, Float64Array.of(1, 0, 0, -Infinity)),
    ).toBe(Infinity);
    expect(() => luGrowthFactor(a, 2, new Float64Array(3))).toThrow(RangeError);
  });
});

describe('ldltGrowthFactor', () => {
  it('equals the LU growth factor with U = DLᵀ for a symmetric matrix factored without pivoting', () => {
    // Hand computation: A = [[4,2,2],[2,5,3],[2,3,6]] has L = [[1],[.5,1],[.5,.5,1]], D = (4,4,4)
    // and U = DLᵀ = [[4,2,2],[0,4,2],[0,0,4]], so the growth is 4/6.
    const a = Float64Array.of(4, 2, 2, 2, 5, 3, 2, 3, 6);
    const l = Float64Array.of(1, 0, 0, 0.5, 1, 0, 0.5, 0.5, 1);
    const d = Float64Array.of(4, 4, 4);
    expect(ldltGrowthFactor(a, 3, l, d)).toBe(4 / 6);
    expect(luGrowthFactor(a, 3, luNoPivot(a, 3).lu)).toBe(4 / 6);
  });

  it('sees growth in the off-diagonal entries d_k·l_jk, not only in D', () => {
    // Hand: A = [[1, 4], [4, 17]] = L·D·Lᵀ with l_21 = 4, D = (1, 1): max|DLᵀ| = 4, max|D| = 1.
    expect(
      ldltGrowthFactor(
        Float64Array.of(1, 4, 4, 17),
        2,
        Float64Array.of(1, 0, 4, 1),
        Float64Array.of(1, 1),
      ),
    ).toBe(4 / 17);
    // A tiny pivot: A = [[2^-20, 1], [1, 0]], d = (2^-20, −2^20), l_21 = 2^20: growth 2^20.
    const e = 2 ** -20;
    expect(
      ldltGrowthFactor(
        Float64Array.of(e, 1, 1, 0),
        2,
        Float64Array.of(1, 0, 1 / e, 1),
        Float64Array.of(e, -1 / e),
      ),
    ).toBe(2 ** 20);
  });

  it('stays finite for a matrix near overflow and reports non-finite factors as Infinity', () => {
    const s = 2 ** 1000;
    const a = Float64Array.of(4, 2, 2, 2, 5, 3, 2, 3, 6).map((v) => v * s);
    const l = Float64Array.of(1, 0, 0, 0.5, 1, 0, 0.5, 0.5, 1);
    expect(
      ldltGrowthFactor(
        a,
        3,
        l,
        Float64Array.of(4, 4, 4).map((v) => v * s),
      ),
    ).toBe(4 / 6);
    expect(ldltGrowthFactor(a, 3, l, Float64Array.of(4, NaN, 4))).toBe(Infinity);
    // l_21 = 1e308 with d_1 = 4·2^1000: the growth 1e308·4/6 is still a double; with an
    // unscaled A it exceeds the double range and is reported as Infinity.
    const huge = Float64Array.of(1, 0, 0, 1e308, 1, 0, 0.5, 0.5, 1);
    const d = Float64Array.of(4 * s, 4, 4);
    expect(ldltGrowthFactor(a, 3, huge, d) / (1e308 * (4 / 6))).toBeCloseTo(1, 14);
    expect(
      ldltGrowthFactor(
        a.map((v) => v / s),
        3,
        huge,
        d,
      ),
    ).toBe(Infinity);
  });
});
