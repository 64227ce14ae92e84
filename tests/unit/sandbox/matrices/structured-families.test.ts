import { describe, expect, it } from 'vitest';
import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { determinantExact, div, fromDoubles, mul, rational, sub } from '@tests/helpers/rational.ts';
import { growthFactor, matmul, pivotsOf } from '@tests/helpers/dense-matrix.ts';
import { gepp, luNoPivot, luSolve } from '@tests/helpers/factorizations.ts';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('frank', () => {
  it('matches the definition, det 1 and F·e_n = 1', () => {
    // frank.m, frank.py (references §4.6): row 1 of F₅ is 5 4 3 2 1, det 1 (§11 row 24),
    // F·(0,…,0,1)ᵀ = (1,…,1)ᵀ (Burkardt).
    const f = generateMatrix({ family: 'frank', n: 5 });
    expect(Array.from(f.data.slice(0, 10))).toEqual([5, 4, 3, 2, 1, 4, 4, 3, 2, 1]);
    expect(Array.from(f.data.slice(20))).toEqual([0, 0, 0, 1, 1]);
    for (const n of [5, 12, 20]) {
      const g = generateMatrix({ family: 'frank', n });
      expect(determinantExact(fromDoubles(g.data), n)).toEqual(rational(1));
      const e = new Float64Array(n);
      e[n - 1] = 1;
      expect(Array.from(matmul(g.data, e, n, n, 1))).toEqual(new Array(n).fill(1));
    }
  });

  it('has exact no-pivot LU pivots n, then (n+1−k)/(n+2−k), and computed ones far from zero', () => {
    // Derived by elimination on the Hessenberg form (frank.ts), checked here in exact arithmetic;
    // in double the late pivots drift (κ₂ beyond 1e19 already at n = 20, references §4.6) but
    // stay well away from zero, which is what the 'factor' expectation needs.
    for (const n of [5, 12]) {
      const a = fromDoubles(generateMatrix({ family: 'frank', n }).data);
      for (let k = 0; k < n; k++) {
        const pivot = a[k * n + k]!;
        expect(pivot).toEqual(k === 0 ? rational(n) : rational(n - k, n + 1 - k));
        for (let i = k + 1; i < n; i++) {
          const l = div(a[i * n + k]!, pivot);
          for (let j = k; j < n; j++) a[i * n + j] = sub(a[i * n + j]!, mul(l, a[k * n + j]!));
        }
      }
    }
    for (const n of [20, 64, 200]) {
      const { lu, zeroPivotAt } = luNoPivot(generateMatrix({ family: 'frank', n }).data, n);
      expect(zeroPivotAt).toBeUndefined();
      expect(Math.min(...pivotsOf(lu, n).map(Math.abs))).toBeGreaterThan(0.01);
    }
    const big = generateMatrix({ family: 'frank', n: 20 });
    expect(big.properties.expectations['lu-no-pivoting']).toBe('factor');
    expect(big.properties.expectations['lu-partial-pivoting']).toBeUndefined();
  });
});

describe('kahan', () => {
  it('follows the diag(1, s, …)·(I − c·N) convention with the published small diagonal', () => {
    // kahan.m (references §4.7; §11 row 25): at n = 100, θ = 1.2 the smallest diagonal entry is 9.42e-4.
    const n = 100;
    const k = generateMatrix({ family: 'kahan', n });
    const s = Math.sin(1.2);
    const c = Math.cos(1.2);
    expect(k.data[0]).toBe(1);
    expect(k.data[1]).toBe(-c);
    expect(rel(k.data[1 * n + 1]!, s)).toBeLessThan(1e-15);
    expect(rel(k.data[(n - 1) * n + n - 1]!, 9.42e-4)).toBeLessThan(1e-3);
    expect(k.properties.upperTriangular).toBe(true);
    // Already upper triangular: GEPP makes no exchange and returns K itself.
    const out = gepp(k.data, n);
    expect(Array.from(out.perm)).toEqual(Array.from({ length: n }, (_, i) => i));
    for (let i = 0; i < n; i++)
      for (let j = i; j < n; j++) expect(out.lu[i * n + j]).toBe(k.data[i * n + j]);
  });

  it('has the closed-form inverse and the published κ₁ at n = 30', () => {
    // (K⁻¹)_ii = 1/s^{i−1}, (K⁻¹)_ij = c(1+c)^{j−i−1}/s^{j−1} (j > i) (references §4.7);
    // κ₁(K₃₀) = 2.879369e5 (references §4.7, computed).
    const n = 10;
    const k = generateMatrix({ family: 'kahan', n });
    const s = Math.sin(1.2);
    const c = Math.cos(1.2);
    for (let i = 1; i <= n; i++)
      for (let j = 1; j <= n; j++) {
        let sum = 0;
        for (let m = i; m <= j; m++) {
          const inv = m === j ? 1 / s ** (j - 1) : (c * (1 + c) ** (j - m - 1)) / s ** (j - 1);
          sum += k.data[(i - 1) * n + m - 1]! * inv;
        }
        expect(Math.abs(sum - (i === j ? 1 : 0))).toBeLessThan(1e-13);
      }
    const facts = exactFacts(generateMatrix({ family: 'kahan', n: 30 }).data, 30, Infinity);
    expect(rel(facts!.condition1!, 2.879369e5)).toBeLessThan(1e-6);
  });
});

describe('vandermonde', () => {
  it('uses increasing powers of 1..n, whose determinant is the superfactorial', () => {
    // References §4.13 and §11 row 31: det = 2, 12, 288, 34560, 24883200, 125411328000 (n = 3…8).
    const dets = [2, 12, 288, 34560, 24883200, 125411328000];
    dets.forEach((det, k) => {
      const n = k + 3;
      const v = generateMatrix({ family: 'vandermonde', n });
      expect(v.data[(n - 1) * n + n - 1]).toBe(n ** (n - 1));
      expect(determinantExact(fromDoubles(v.data), n)).toEqual(rational(det));
    });
    expect(() => generateMatrix({ family: 'vandermonde', n: 200 })).toThrow(/128/);
  });
});

describe('worst-growth', () => {
  it('shows growth 2^(n−1) with first-maximum ties and 2 with last-maximum ties', () => {
    // References §3 and §11 rows 7–8: 512 (n = 10), 524288 (n = 20); a `>=` scan gives 2.
    for (const [n, growth] of [
      [10, 512],
      [20, 524288],
    ] as const) {
      const w = generateMatrix({ family: 'worst-growth', n });
      expect(growthFactor(gepp(w.data, n, 'first').lu, w.data, n)).toBe(growth);
      expect(growthFactor(gepp(w.data, n, 'last').lu, w.data, n)).toBe(2);
    }
  });

  it('shows growth 1.5^(n−1) under any tie rule for α = 0.5', () => {
    // References §11 row 9: 38.443359375 (n = 10), 127834.03948858939 (n = 30), exact.
    for (const [n, growth] of [
      [10, 38.443359375],
      [30, 127834.03948858939],
    ] as const) {
      const w = generateMatrix({ family: 'worst-growth', n, params: { alpha: 0.5 } });
      expect(w.id).toBe(`worst-growth-n${n}-alpha0.5`);
      expect(growthFactor(gepp(w.data, n, 'first').lu, w.data, n)).toBe(growth);
      expect(growthFactor(gepp(w.data, n, 'last').lu, w.data, n)).toBe(growth);
    }
  });

  it('has κ₁ = n, yet GEPP loses the whole solution from n = 55', () => {
    // References §11 rows 10–11: κ₁ = n; with b = W·1, GEPP's ∞-norm error is 0 for n ≤ 54, 1.0 for n ≥ 55.
    for (const n of [10, 20, 60])
      expect(generateMatrix({ family: 'worst-growth', n }).properties.exactCondition1).toBe(n);
    for (const [n, error] of [
      [54, 0],
      [55, 1],
      [60, 1],
    ] as const) {
      const w = generateMatrix({ family: 'worst-growth', n });
      const b = matmul(w.data, new Float64Array(n).fill(1), n, n, 1); // integers: exact
      const x = luSolve(gepp(w.data, n), b, n);
      expect(Math.max(...Array.from(x, (v) => Math.abs(v - 1)))).toBe(error);
    }
  });

  it('has exact GEPP factors at n = 60 that a residual evaluated in double misjudges', () => {
    // References §1.5 and §11 row 12: P·L·U − A is exactly 0, yet the GET01 ratio evaluated in
    // double is about 1.5e13 (the test's own summation order may differ, so only its size is checked).
    const n = 60;
    const w = generateMatrix({ family: 'worst-growth', n });
    const { lu, perm } = gepp(w.data, n);
    let exactlyZero = true;
    let worstColumn = 0;
    for (let j = 0; j < n; j++) {
      let column = 0;
      for (let i = 0; i < n; i++) {
        let exact = 0n;
        let rounded = 0;
        for (let k = 0; k <= Math.min(i, j); k++) {
          const l = k === i ? 1 : lu[i * n + k]!;
          exact += BigInt(l) * BigInt(lu[k * n + j]!);
          rounded += l * lu[k * n + j]!;
        }
        const a = w.data[perm[i]! * n + j]!;
        if (exact !== BigInt(a)) exactlyZero = false;
        column += Math.abs(a - rounded);
      }
      worstColumn = Math.max(worstColumn, column);
    }
    expect(exactlyZero).toBe(true);
    expect(worstColumn / (n * n * UNIT_ROUNDOFF)).toBeGreaterThan(1e12);
  });

  it('validates α and the size that keeps U finite', () => {
    expect(() => generateMatrix({ family: 'worst-growth', n: 5, params: { alpha: 1.5 } })).toThrow(
      /alpha/,
    );
    expect(() => generateMatrix({ family: 'worst-growth', n: 1100 })).toThrow(/2\^1000/);
  });
});

describe('diagonally-dominant', () => {
  it('is strictly dominant by rows and columns, so GEPP exchanges no rows', () => {
    const n = 30;
    for (const params of [{}, { upper: 1 }] as Record<string, number>[]) {
      const a = generateMatrix({ family: 'diagonally-dominant', n, seed: 9, params });
      for (let i = 0; i < n; i++) {
        let row = 0;
        let col = 0;
        for (let j = 0; j < n; j++)
          if (j !== i) {
            row += Math.abs(a.data[i * n + j]!);
            col += Math.abs(a.data[j * n + i]!);
          }
        expect(a.data[i * n + i]! - Math.max(row, col)).toBeGreaterThan(0.99);
      }
      expect(Array.from(gepp(a.data, n).perm)).toEqual(Array.from({ length: n }, (_, i) => i));
      expect(a.properties.upperTriangular).toBe('upper' in params);
    }
  });
});

describe('graded, near-overflow, near-underflow', () => {
  it('grades rows over the requested decades by exact powers of two', () => {
    const n = 20;
    const a = generateMatrix({ family: 'graded', n, seed: 2 });
    const rowMax = (i: number) => Math.max(...Array.from(a.data.slice(i * n, i * n + n), Math.abs));
    // Row scales run from 1 to 2^-round(12·log₂10) ≈ 1e-12; the random rows add at most a factor ~20.
    expect(Math.log10(rowMax(0) / rowMax(n - 1))).toBeGreaterThan(10.5);
    expect(Math.log10(rowMax(0) / rowMax(n - 1))).toBeLessThan(13.5);
    expect(a.properties.expectations['lu-partial-pivoting']).toBe('factor');
    expect(
      generateMatrix({ family: 'graded', n: 8, seed: 2 }).properties.exactCondition1!,
    ).toBeGreaterThan(1e11);
  });

  it('puts entries near 1e300 where naive sums of squares overflow but LU stays finite', () => {
    const n = 16;
    const a = generateMatrix({ family: 'near-overflow', n, seed: 1 });
    const max = Math.max(...Array.from(a.data, Math.abs));
    expect(max).toBeGreaterThan(1e299);
    expect(max).toBeLessThan(6.8e299);
    let squares = 0;
    for (let i = 0; i < n; i++) squares += a.data[i * n]! ** 2;
    expect(squares).toBe(Infinity);
    const { lu, zeroPivotAt } = gepp(a.data, n);
    expect(zeroPivotAt).toBeUndefined();
    expect(lu.every(Number.isFinite)).toBe(true);
  });

  it('puts entries near 1e-300 where naive sums of squares underflow but LU is fine', () => {
    const n = 16;
    const a = generateMatrix({ family: 'near-underflow', n, seed: 1 });
    expect(Math.max(...Array.from(a.data, Math.abs))).toBeLessThan(1.6e-300);
    let squares = 0;
    for (let i = 0; i < n; i++) squares += a.data[i * n]! ** 2;
    expect(squares).toBe(0);
    const { lu, zeroPivotAt } = gepp(a.data, n);
    expect(zeroPivotAt).toBeUndefined();
    expect(pivotsOf(lu, n).every((u) => Math.abs(u) > 1e-303)).toBe(true);
    // Same κ as the unscaled uniform matrix: the scale is an exact power of two.
    const b = generateMatrix({ family: 'near-overflow', n: 6, seed: 1 });
    const c = generateMatrix({ family: 'near-underflow', n: 6, seed: 1 });
    expect(b.properties.exactCondition1).toBeGreaterThan(1);
    expect(c.properties.exactCondition1).toBeGreaterThan(1);
  });
});
