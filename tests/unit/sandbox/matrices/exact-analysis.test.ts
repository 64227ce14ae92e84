import { describe, expect, it } from 'vitest';
import { exactFacts, exactIntegerInverse } from '@sandbox/matrices/exact-analysis.ts';
import { dyadicParts, rationalToNumber, scaledIntegers } from '@sandbox/matrices/exact-integers.ts';
import { createRandom } from '@sandbox/matrices/random.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';

/** Exact Hilbert H_n scaled by L = lcm(1..2n−1) to an integer matrix. */
function scaledHilbert(n: number): bigint[] {
  let l = 1n;
  const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? a : gcd(b, a % b));
  for (let k = 1n; k <= BigInt(2 * n - 1); k++) l = (l * k) / gcd(l, k);
  const m: bigint[] = [];
  for (let i = 1; i <= n; i++) for (let j = 1; j <= n; j++) m.push(l / BigInt(i + j - 1));
  return m;
}

function integerMatMul(a: bigint[], b: bigint[], n: number): bigint[] {
  const c: bigint[] = [];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = 0n;
      for (let k = 0; k < n; k++) s += a[i * n + k]! * b[k * n + j]!;
      c.push(s);
    }
  return c;
}

describe('exact conversions', () => {
  it('splits doubles into odd mantissa times a power of two', () => {
    // IEEE 754 binary64: 0.75 = 3·2^-2, the smallest subnormal is 2^-1074, -6 = -3·2^1.
    expect(dyadicParts(0.75)).toEqual({ mantissa: 3n, exponent: -2 });
    expect(dyadicParts(5e-324)).toEqual({ mantissa: 1n, exponent: -1074 });
    expect(dyadicParts(-6)).toEqual({ mantissa: -3n, exponent: 1 });
    expect(dyadicParts(0)).toEqual({ mantissa: 0n, exponent: 0 });
    expect(() => dyadicParts(Infinity)).toThrow(RangeError);
  });

  it('scales a list to integers with one common exponent', () => {
    expect(scaledIntegers([0.5, 3, 0, -0.25])).toEqual({ ints: [2n, 12n, 0n, -1n], exponent: -2 });
    expect(scaledIntegers([0, 0])).toEqual({ ints: [0n, 0n], exponent: 0 });
  });

  it('rounds fractions to the nearest double', () => {
    expect(rationalToNumber(1n, 3n)).toBe(1 / 3);
    expect(rationalToNumber(-2n, 7n)).toBe(-2 / 7);
    expect(rationalToNumber(1970389773n, 2n)).toBe(985194886.5);
    // (2^53 + 1)/1 is a tie between 2^53 and 2^53 + 2: ties go to even, 2^53.
    expect(rationalToNumber(2n ** 53n + 1n, 1n)).toBe(2 ** 53);
    // Just above the tie rounds up.
    expect(rationalToNumber(2n ** 54n + 3n, 2n)).toBe(2 ** 53 + 2);
    expect(rationalToNumber(10n ** 400n, 10n ** 100n)).toBe(1e300);
    expect(() => rationalToNumber(1n, 0n)).toThrow(RangeError);
  });
});

describe('exactIntegerInverse', () => {
  it('returns det and adjugate with M·adj = det·I, also when row exchanges are needed', () => {
    const r = createRandom(11);
    for (const n of [1, 2, 3, 5, 8]) {
      for (let trial = 0; trial < 5; trial++) {
        const m = Array.from({ length: n * n }, () => BigInt(Math.floor(r.uniform() * 7) - 3));
        const { det, adjugate } = exactIntegerInverse(m, n);
        if (det === 0n) continue;
        const product = integerMatMul(m, adjugate, n);
        product.forEach((x, k) => expect(x).toBe(Math.floor(k / n) === k % n ? det : 0n));
      }
    }
    // A zero first pivot forces an exchange: [[0, 1], [1, 0]] has det −1 and is its own inverse.
    const swap = exactIntegerInverse([0n, 1n, 1n, 0n], 2);
    expect(swap.det).toBe(-1n);
    expect(swap.adjugate).toEqual([0n, -1n, -1n, 0n]);
    expect(swap.leadingMinorSigns).toEqual([0]);
  });

  it('gives the inverse of H₄ and the entry sums n² of H_n⁻¹', () => {
    // References §11 row 13 (SciPy invhilbert docs) and row 14 (Burkardt hilbert.py).
    const h4 = exactIntegerInverse(scaledHilbert(4), 4);
    const l = 420n; // lcm(1..7)
    const inv = h4.adjugate.map((x) => (x * l) / h4.det);
    expect(inv).toEqual(
      [
        16, -120, 240, -140, -120, 1200, -2700, 1680, 240, -2700, 6480, -4200, -140, 1680, -4200,
        2800,
      ].map(BigInt),
    );
    for (let n = 2; n <= 12; n++) {
      const m = scaledHilbert(n);
      const { det, adjugate } = exactIntegerInverse(m, n);
      const sum = adjugate.reduce((s, x) => s + x, 0n);
      // H⁻¹ = L·adj(M)/det(M) for M = L·H; its entries sum to n².
      const lcm = m[0]!;
      expect(sum * lcm).toBe(BigInt(n * n) * det);
    }
  });

  it('gives the exact κ₁ and det of the exact Hilbert matrices', () => {
    // κ₁(H_n) for n = 2…10: references §11 row 15 (computed exactly there; n = 3 also in
    // MathWorks' cond documentation). det H_n for n = 2…5: row 17.
    const kappa: [number, bigint, bigint][] = [
      [2, 27n, 1n],
      [3, 748n, 1n],
      [4, 28375n, 1n],
      [5, 943656n, 1n],
      [6, 29070279n, 1n],
      [7, 1970389773n, 2n],
      [8, 33872791095n, 1n],
      [9, 2199309082685n, 2n],
      [10, 35357439251992n, 1n],
    ];
    for (const [n, num, den] of kappa) {
      const m = scaledHilbert(n);
      const { det, adjugate } = exactIntegerInverse(m, n);
      const colMax = (x: bigint[]) =>
        Array.from({ length: n }, (_, j) =>
          Array.from({ length: n }, (_, i) => x[i * n + j]!).reduce(
            (s, v) => s + (v < 0n ? -v : v),
            0n,
          ),
        ).reduce((a, b) => (a > b ? a : b));
      const abs = (v: bigint) => (v < 0n ? -v : v);
      // κ₁ = ‖M‖₁·‖adj M‖₁/|det M| (the scale cancels) equals num/den exactly.
      expect(colMax(m) * colMax(adjugate) * den).toBe(num * abs(det));
    }
    const dets: [number, bigint][] = [
      [2, 12n],
      [3, 2160n],
      [4, 6048000n],
      [5, 266716800000n],
    ];
    for (const [n, inverse] of dets) {
      const m = scaledHilbert(n);
      const { det } = exactIntegerInverse(m, n);
      // det(L·H) = L^n·det H with det H = 1/inverse.
      expect(det * inverse).toBe(m[0]! ** BigInt(n));
    }
  });
});

describe('exactFacts', () => {
  it('describes the stored fl(H_n), not H_n', () => {
    // κ₁(fl(H_n)) computed exactly from the doubles: references §4.1 table and §11 row 18.
    const cases: [number, number][] = [
      [8, 3.3872791001e10],
      [10, 3.5354248023e13],
      [12, 4.0402117223e16],
      [13, 5.1245775246e18],
    ];
    for (const [n, expected] of cases) {
      const facts = exactFacts(generateMatrix({ family: 'hilbert', n }).data, n, Infinity);
      expect(Math.abs(facts!.condition1! / expected - 1)).toBeLessThan(1e-9);
      expect(facts!.leadingMinorsPositive).toBe(true);
    }
  });

  it('finds singular matrices and the first zero leading minor', () => {
    // [[1,1,1],[1,1,2],[1,2,2]]: leading 2×2 minor singular, det −1 (references §11 row 38).
    const facts = exactFacts([1, 1, 1, 1, 1, 2, 1, 2, 2], 3)!;
    expect(facts.singular).toBe(false);
    expect(facts.firstZeroLeadingMinor).toBe(2);
    expect(facts.leadingMinorsPositive).toBe(false);
    // κ₁ = ‖A‖₁·‖A⁻¹‖₁ = 5·3 with A⁻¹ = [[2,0,−1],[0,−1,1],[−1,1,0]] (by hand: A·A⁻¹ = I).
    expect(facts.condition1).toBe(15);
    const rank2 = exactFacts([1, 2, 3, 4, 5, 6, 7, 8, 9], 3)!;
    expect(rank2.singular).toBe(true);
    expect(rank2.condition1).toBeUndefined();
  });

  it('returns undefined when the work would be too large', () => {
    const big = generateMatrix({ family: 'uniform', n: 40, seed: 1 }).data;
    expect(exactFacts(big, 40)).toBeUndefined();
    expect(() => exactFacts([1, 2, 3], 2)).toThrow(RangeError);
  });
});
