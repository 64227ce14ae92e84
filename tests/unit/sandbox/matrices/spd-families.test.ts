import { describe, expect, it } from 'vitest';
import { exactIntegerInverse } from '@sandbox/matrices/exact-analysis.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { scaledIntegers } from '@sandbox/matrices/exact-integers.ts';
import { extremeEigenvalues } from './eigen-estimates.ts';
import {
  type Rational,
  determinantExact,
  fromDoubles,
  isIdentity,
  matMulExact,
  rational,
} from '@tests/helpers/rational.ts';
import { pivotsOf } from '@tests/helpers/dense-matrix.ts';
import { cholesky, luNoPivot } from '@tests/helpers/factorizations.ts';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

function binomial(n: number, k: number): bigint {
  let r = 1n;
  for (let i = 1; i <= k; i++) r = (r * BigInt(n - k + i)) / BigInt(i);
  return r;
}

describe('hilbert', () => {
  it('stores the rounded 1/(i+j−1) and is SPD', () => {
    // Definition: Higham's Test Matrix Toolbox hilb.m (references §4.1).
    const h = generateMatrix({ family: 'hilbert', n: 5 });
    expect(h.data[0]).toBe(1);
    expect(h.data[1 * 5 + 2]).toBe(1 / 4);
    expect(h.properties.symmetric && h.properties.positiveDefinite).toBe(true);
  });

  it('has the published κ₂ for small n', () => {
    // κ₂(H_n): references §11 row 16 (n = 3, 4 also in MathWorks' cond and hilb documentation);
    // fl(H_n) differs from H_n by about κ·u relative, far below these tolerances.
    const cases: [number, number][] = [
      [3, 524.056777586],
      [4, 15513.7387389],
      [5, 476607.250243],
      [6, 1.49510586401e7],
    ];
    for (const [n, kappa] of cases) {
      const h = generateMatrix({ family: 'hilbert', n });
      const { min, max } = extremeEigenvalues(h.data, n);
      expect(rel(max / min, kappa)).toBeLessThan(1e-8);
    }
  });

  it('reports κ₁ of the stored matrix and leaves out LU once it is numerically singular', () => {
    // κ₁(fl(H₁₀)) = 3.5354248023e13 (references §4.1 table).
    const h10 = generateMatrix({ family: 'hilbert', n: 10 });
    expect(rel(h10.properties.exactCondition1!, 3.5354248023e13)).toBeLessThan(1e-9);
    const h14 = generateMatrix({ family: 'hilbert', n: 14 });
    expect(h14.properties.expectations['lu-partial-pivoting']).toBeUndefined();
    expect(h14.properties.expectations['householder-qr']).toBe('factor');
  });
});

describe('pascal', () => {
  it('holds the binomials C(i+j−2, i−1), det 1 and an integer inverse', () => {
    // pascal.m (references §4.2); det P_n = 1 (§11 row 20).
    for (const n of [4, 8, 12]) {
      const p = generateMatrix({ family: 'pascal', n });
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) expect(BigInt(p.data[i * n + j]!)).toBe(binomial(i + j, i));
      const { ints, exponent } = scaledIntegers(p.data);
      expect(exponent).toBeGreaterThanOrEqual(0);
      const { det } = exactIntegerInverse(ints, n);
      expect(det * 2n ** BigInt(exponent * n)).toBe(1n);
    }
  });

  it('gives the binomial Cholesky factor bit for bit up to n = 29, not at n = 30', () => {
    // References §11 row 19: L_ij = C(i−1, j−1) exactly for n ≤ 29; first inexact at n = 30.
    const exact = (n: number) => {
      const { l } = cholesky(generateMatrix({ family: 'pascal', n }).data, n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j <= i; j++) if (BigInt(l[i * n + j]!) !== binomial(i, j)) return false;
      return true;
    };
    expect(exact(29)).toBe(true);
    expect(exact(30)).toBe(false);
    expect(generateMatrix({ family: 'pascal', n: 29 }).properties.expectations.cholesky).toBe(
      'factor',
    );
  });

  it('has reciprocal extreme eigenvalues and the published κ₂', () => {
    // λ_min·λ_max = 1 and κ₂(P₈) = 2.06451734e7 (references §4.2, mpmath).
    const p = generateMatrix({ family: 'pascal', n: 8 });
    const { min, max } = extremeEigenvalues(p.data, 8);
    expect(rel(min * max, 1)).toBeLessThan(1e-10);
    expect(rel(max / min, 2.06451734e7)).toBeLessThan(1e-8);
  });
});

describe('lehmer', () => {
  it('matches the closed-form inverse and determinant in exact arithmetic', () => {
    // Inverse tridiagonal: (A⁻¹)_ii = 4i³/(4i²−1) (i < n), (A⁻¹)_nn = n²/(2n−1),
    // (A⁻¹)_{i,i+1} = −i(i+1)/(2i+1); det = (2n)!/(2ⁿ(n!)³): 5/12, 21/320, 143/114688
    // (n = 3, 5, 8). References §4.5 and §11 row 23 (Burkardt lehmer.py, Newman & Todd 1958).
    const dets: [number, Rational][] = [
      [3, rational(5, 12)],
      [5, rational(21, 320)],
      [8, rational(143, 114688)],
    ];
    for (const [n, det] of dets) {
      const a: Rational[] = [];
      const inv: Rational[] = [];
      for (let i = 1; i <= n; i++)
        for (let j = 1; j <= n; j++) {
          a.push(rational(Math.min(i, j), Math.max(i, j)));
          if (i === j)
            inv.push(i < n ? rational(4 * i ** 3, 4 * i * i - 1) : rational(n * n, 2 * n - 1));
          else if (Math.abs(i - j) === 1) {
            const k = Math.min(i, j);
            inv.push(rational(-k * (k + 1), 2 * k + 1));
          } else inv.push(rational(0));
        }
      expect(isIdentity(matMulExact(a, inv, n, n, n), n)).toBe(true);
      expect(determinantExact(a, n)).toEqual(det);
      // The generator stores exactly these entries, rounded.
      const g = generateMatrix({ family: 'lehmer', n });
      a.forEach((x, k) => expect(g.data[k]).toBe(Number(x.num) / Number(x.den)));
    }
  });

  it('has the Cholesky factor √(2j−1)/i and the published κ₂', () => {
    // References §4.5: L_ij = √(2j−1)/i for i ≥ j; κ₂ = 19.6555 (n = 5), 86.3893 (n = 10).
    const n = 6;
    const { l } = cholesky(generateMatrix({ family: 'lehmer', n }).data, n);
    for (let i = 1; i <= n; i++)
      for (let j = 1; j <= i; j++)
        expect(rel(l[(i - 1) * n + j - 1]!, Math.sqrt(2 * j - 1) / i)).toBeLessThan(1e-14);
    for (const [m, kappa] of [
      [5, 19.6555],
      [10, 86.3893],
    ] as const) {
      const { min, max } = extremeEigenvalues(generateMatrix({ family: 'lehmer', n: m }).data, m);
      expect(rel(max / min, kappa)).toBeLessThan(1e-5);
    }
  });
});

describe('minij', () => {
  it('has the all-ones Cholesky factor, a tridiagonal inverse, det 1 and the closed-form κ₁', () => {
    // minij.m (references §4.3; §11 row 21): inverse tridiag(−1, 2, −1) with 1 at (n, n).
    for (const n of [1, 2, 6, 50]) {
      const a = generateMatrix({ family: 'minij', n });
      const { l } = cholesky(a.data, n);
      for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) expect(l[i * n + j]).toBe(1);
      const t = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        t[i * n + i] = i === n - 1 ? 1 : 2;
        if (i > 0) t[i * n + i - 1] = -1;
        if (i < n - 1) t[i * n + i + 1] = -1;
      }
      // A·T in integers (exact in double): the identity.
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          let s = 0;
          for (let k = 0; k < n; k++) s += a.data[i * n + k]! * t[k * n + j]!;
          expect(s).toBe(i === j ? 1 : 0);
        }
      // κ₁ = ‖A‖₁·‖T‖₁ from the two matrices directly.
      const col = (m: ArrayLike<number>) =>
        Math.max(
          ...Array.from({ length: n }, (_, j) =>
            Array.from({ length: n }, (_, i) => Math.abs(m[i * n + j]!)).reduce((s, v) => s + v, 0),
          ),
        );
      expect(a.properties.exactCondition1).toBe(col(a.data) * col(t));
    }
  });
});

describe('moler', () => {
  it('is L·Lᵀ with L unit lower with −1 below, det 1, and has the published κ₂', () => {
    // moler.m (references §4.4; §11 row 22): Cholesky in double reproduces L bit for bit (n = 30);
    // κ₂ = 865.98 (n = 5), 3.6806e6 (n = 10).
    const n = 30;
    const a = generateMatrix({ family: 'moler', n });
    expect(a.data[0]).toBe(1);
    expect(a.data[4 * n + 4]).toBe(5);
    expect(a.data[2 * n + 6]).toBe(1); // min(3, 7) − 2
    const { l } = cholesky(a.data, n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j <= i; j++) expect(l[i * n + j]).toBe(i === j ? 1 : -1);
    for (const [m, kappa] of [
      [5, 865.98],
      [10, 3.6806e6],
    ] as const) {
      const g = generateMatrix({ family: 'moler', n: m });
      const { min, max } = extremeEigenvalues(g.data, m, 2000);
      expect(rel(max / min, kappa)).toBeLessThan(1e-4);
      expect(determinantExact(fromDoubles(g.data), m)).toEqual(rational(1));
    }
    expect(a.properties.expectations.cholesky).toBe('factor');
  });

  it('takes α as a parameter', () => {
    // α = 2: a_11 = 1, a_12 = α = 2, a_22 = α² + 1 = 5, a_23 = α² + α = 6 (entrywise formula).
    const a = generateMatrix({ family: 'moler', n: 3, params: { alpha: 2 } });
    expect(Array.from(a.data)).toEqual([1, 2, 2, 2, 5, 6, 2, 6, 9]);
    expect(a.id).toBe('moler-n3-alpha2');
  });
});

describe('poisson-1d', () => {
  it('has eigenpairs 2 − 2cos(kπ/(n+1)), sin(ijπ/(n+1))', () => {
    // References §4.8 (Burkardt dif2.py).
    const n = 10;
    const t = generateMatrix({ family: 'poisson-1d', n });
    for (let k = 1; k <= n; k++) {
      const lambda = 2 - 2 * Math.cos((k * Math.PI) / (n + 1));
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let j = 0; j < n; j++)
          s += t.data[i * n + j]! * Math.sin(((j + 1) * k * Math.PI) / (n + 1));
        expect(Math.abs(s - lambda * Math.sin(((i + 1) * k * Math.PI) / (n + 1)))).toBeLessThan(
          1e-14,
        );
      }
    }
  });

  it('has the published κ₁ and det, and LU pivots (i+1)/i', () => {
    // References §11 rows 27–28: κ₁ = 18, 60, 1300, 5100 (n = 5, 10, 50, 100); det = n + 1;
    // no-pivot LU: u_ii = (i+1)/i, l_{i+1,i} = −i/(i+1) to 2u.
    const kappas: [number, number][] = [
      [5, 18],
      [10, 60],
      [50, 1300],
      [100, 5100],
    ];
    for (const [n, kappa] of kappas)
      expect(generateMatrix({ family: 'poisson-1d', n }).properties.exactCondition1).toBe(kappa);
    const n = 12;
    const t = generateMatrix({ family: 'poisson-1d', n });
    expect(determinantExact(fromDoubles(t.data), n)).toEqual(rational(n + 1));
    const { lu } = luNoPivot(t.data, n);
    pivotsOf(lu, n).forEach((u, i) =>
      expect(rel(u, (i + 2) / (i + 1))).toBeLessThanOrEqual(2 ** -52),
    );
    for (let i = 1; i < n; i++)
      expect(rel(lu[i * n + i - 1]!, -i / (i + 1))).toBeLessThanOrEqual(2 ** -52);
  });
});

describe('poisson-2d', () => {
  it('is the 5-point Laplacian with eigenvalues λ_i + λ_j', () => {
    // A = I ⊗ T_k + T_k ⊗ I: eigenvectors are products of the 1-D ones (references §4.8).
    const k = 4;
    const n = k * k;
    const a = generateMatrix({ family: 'poisson-2d', n });
    const mu = (p: number) => 2 - 2 * Math.cos((p * Math.PI) / (k + 1));
    for (const [p, q] of [
      [1, 1],
      [2, 3],
      [4, 4],
    ] as const) {
      const v = Float64Array.from(
        { length: n },
        (_, idx) =>
          Math.sin(((Math.floor(idx / k) + 1) * p * Math.PI) / (k + 1)) *
          Math.sin((((idx % k) + 1) * q * Math.PI) / (k + 1)),
      );
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let j = 0; j < n; j++) s += a.data[i * n + j]! * v[j]!;
        expect(Math.abs(s - (mu(p) + mu(q)) * v[i]!)).toBeLessThan(1e-14);
      }
    }
    expect(a.properties.symmetric && a.properties.positiveDefinite).toBe(true);
    expect(() => generateMatrix({ family: 'poisson-2d', n: 10 })).toThrow(/perfect square/);
  });
});

describe('spd-random', () => {
  it('is exactly symmetric with λ_min above 0.99·n', () => {
    // B·Bᵀ + n·I: λ_min ≥ n up to rounding; Cholesky of A − 0.99·n·I succeeding proves λ_min > 0.99n.
    for (const n of [5, 40]) {
      const a = generateMatrix({ family: 'spd-random', n, seed: 4 });
      expect(a.properties.symmetric).toBe(true);
      const shifted = Float64Array.from(a.data);
      for (let i = 0; i < n; i++) shifted[i * n + i]! -= 0.99 * n;
      expect(cholesky(shifted, n).failedAt).toBeUndefined();
      expect(a.properties.expectations.cholesky).toBe('factor');
    }
  });
});
