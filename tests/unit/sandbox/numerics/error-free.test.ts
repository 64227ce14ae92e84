import { describe, expect, it } from 'vitest';
import { dot2, split, twoProduct, twoSum } from '@sandbox/numerics/error-free.ts';
import { UNIT_ROUNDOFF, gamma } from '@sandbox/numerics/unit-roundoff.ts';
import {
  type Rational,
  ZERO,
  abs,
  add,
  equals,
  fromDouble,
  mul,
  sub,
  toNumber,
} from '@tests/helpers/rational.ts';
import { mulberry32 } from '@tests/helpers/seeded-random.ts';

/** A double with a full 53-bit random significand, random sign and exponent in [−e, e]. */
function randomDouble(rand: () => number, e: number): number {
  const significand =
    1 + (Math.floor(rand() * 2 ** 26) * 2 ** 26 + Math.floor(rand() * 2 ** 26)) / 2 ** 52;
  const exponent = Math.round((2 * rand() - 1) * e);
  return (rand() < 0.5 ? -1 : 1) * significand * 2 ** exponent;
}

/** Number of significant bits of a double: bit length of the odd numerator of its value. */
function significantBits(x: number): number {
  let n = fromDouble(x).num;
  if (n < 0n) n = -n;
  if (n === 0n) return 0;
  while (n % 2n === 0n) n /= 2n;
  return n.toString(2).length;
}

const exactSum = (a: number, b: number) => add(fromDouble(a), fromDouble(b));
const exactProduct = (a: number, b: number) => mul(fromDouble(a), fromDouble(b));
/** Whether the pair (hi, lo) holds exactly the rational value. */
const holdsExactly = ([hi, lo]: [number, number], value: Rational) =>
  equals(exactSum(hi, lo), value);

/**
 * On 3000 seeded random pairs with exponents in ±100 (numerics-references §11 row 42):
 * transform(a, b) = (fl(a ∘ b), error) with the pair summing exactly to a ∘ b.
 */
function expectErrorFreeOnRandomPairs(
  transform: (a: number, b: number) => [number, number],
  rounded: (a: number, b: number) => number,
  exact: (a: number, b: number) => Rational,
  seed: number,
): void {
  const rand = mulberry32(seed);
  for (let k = 0; k < 3000; k++) {
    const a = randomDouble(rand, 100);
    const b = randomDouble(rand, 100);
    const pair = transform(a, b);
    expect(pair[0]).toBe(rounded(a, b));
    expect(holdsExactly(pair, exact(a, b))).toBe(true);
  }
}

// Cases chosen to stress the transformations: exact ties, huge exponent gaps, cancellation,
// the splitter constant itself, values just below powers of two.
const adversarial: [number, number][] = [
  [1, 2 ** -53],
  [1, -(2 ** -54)],
  [2 ** 53, 1],
  [2 ** 53, 3],
  [0.1, 0.2],
  [1, 1e-300],
  [1e300, -1e300],
  [5, -5],
  [134217729, 134217729],
  [1 + 2 ** -52, 1 - 2 ** -53],
  [2 ** 53 - 1, -(2 ** 53 - 1)],
  [1 / 3, 3],
  [-0.7, 1e-17],
  [2 ** 996, 2 ** -900],
];

describe('twoSum (Knuth, TAOCP vol. 2, §4.2.2)', () => {
  it('a + b = s + e exactly and s = fl(a + b), on random pairs over exponents ±100', () => {
    expectErrorFreeOnRandomPairs(twoSum, (a, b) => a + b, exactSum, 42);
  });

  it('is exact on adversarial pairs, both orders', () => {
    for (const [a, b] of adversarial) {
      for (const [p, q] of [
        [a, b],
        [b, a],
      ] as const) {
        expect(holdsExactly(twoSum(p, q), exactSum(p, q))).toBe(true);
      }
    }
    // A tie: 2^53 + 1 rounds to even (2^53), the lost 1 is the error term.
    expect(twoSum(2 ** 53, 1)).toEqual([2 ** 53, 1]);
  });
});

describe('split (Veltkamp; Dekker 1971)', () => {
  it('a = hi + lo exactly, each part with at most 26 significant bits', () => {
    const rand = mulberry32(7);
    for (let k = 0; k < 2000; k++) {
      const a = randomDouble(rand, 300);
      const [hi, lo] = split(a);
      expect(holdsExactly([hi, lo], fromDouble(a))).toBe(true);
      expect(significantBits(hi)).toBeLessThanOrEqual(26);
      expect(significantBits(lo)).toBeLessThanOrEqual(26);
    }
  });

  it('overflows at 1.5·2^997 but not at 1.5·2^996', () => {
    // numerics-references §11 row 43 (computed there): the splitter 2^27 + 1 overflows the product.
    const [hiBad] = split(1.5 * 2 ** 997);
    expect(Number.isNaN(hiBad)).toBe(true);
    const a = 1.5 * 2 ** 996;
    expect(holdsExactly(split(a), fromDouble(a))).toBe(true);
  });
});

describe('twoProduct (Dekker 1971, mul12)', () => {
  it('a·b = p + e exactly and p = fl(a·b), on random pairs over exponents ±100', () => {
    expectErrorFreeOnRandomPairs(twoProduct, (a, b) => a * b, exactProduct, 4242);
  });

  it('is exact on adversarial pairs', () => {
    for (const [a, b] of adversarial) {
      if (Math.abs(a * b) > 2 ** 1000 || (a * b !== 0 && Math.abs(a * b) < 2 ** -900)) continue;
      expect(holdsExactly(twoProduct(a, b), exactProduct(a, b))).toBe(true);
    }
    // (1 + 2^-52)² = 1 + 2^-51 + 2^-104: the last term is exactly the error.
    expect(twoProduct(1 + 2 ** -52, 1 + 2 ** -52)).toEqual([1 + 2 ** -51, 2 ** -104]);
  });

  it('is not exact once the product underflows (outside its precondition)', () => {
    // numerics-references §6.1 (computed there): near 2^-540 the error term underflows.
    const a = (1 + 2 ** -52) * 2 ** -540;
    expect(holdsExactly(twoProduct(a, a), exactProduct(a, a))).toBe(false);
  });
});

/**
 * Ill-conditioned dot products, following the idea of Ogita, Rump & Oishi 2005, §6 (GenDot):
 * the first half of the terms has exponents spread over [0, E]; each later pair is chosen to
 * cancel most of the exact running sum, with exponents falling from E to 0. Our own code.
 */
function illConditionedDot(n: number, e: number, rand: () => number) {
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const half = n / 2;
  let exact: Rational = ZERO;
  for (let i = 0; i < n; i++) {
    const exp =
      i < half
        ? i === 0
          ? e
          : Math.round(rand() * e)
        : Math.round((e * (n - 1 - i)) / (n - 1 - half));
    x[i] = (2 * rand() - 1) * 2 ** exp;
    y[i] =
      i < half
        ? (2 * rand() - 1) * 2 ** exp
        : ((2 * rand() - 1) * 2 ** exp - toNumber(exact)) / x[i]!;
    exact = add(exact, exactProduct(x[i]!, y[i]!));
  }
  // Shuffle the pairs so that the cancellation is not in summation order.
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [x[i], x[j]] = [x[j]!, x[i]!];
    [y[i], y[j]] = [y[j]!, y[i]!];
  }
  let absDot: Rational = ZERO;
  for (let i = 0; i < n; i++) absDot = add(absDot, abs(exactProduct(x[i]!, y[i]!)));
  return { x, y, exact, absDot: toNumber(absDot) };
}

describe('dot2 (Ogita, Rump & Oishi 2005, Alg. 5.3)', () => {
  it('meets |res − xᵀy| ≤ u|xᵀy| + γ_n²|x|ᵀ|y| on dot products with condition 1e5 … 1e40', () => {
    // Error bound: Ogita, Rump & Oishi 2005, as quoted in numerics-references §6.1.
    const rand = mulberry32(2005);
    const n = 60;
    const conditions: number[] = [];
    // Exponent spread e gives condition numbers 2·|x|ᵀ|y|/|xᵀy| of roughly 2^(2e).
    for (const e of [8, 25, 42, 58, 66]) {
      for (let trial = 0; trial < 4; trial++) {
        const { x, y, exact, absDot } = illConditionedDot(n, e, rand);
        const res = dot2(n, x, 0, 1, y, 0, 1);
        conditions.push((2 * absDot) / Math.abs(toNumber(exact)));
        const err = toNumber(abs(sub(fromDouble(res), exact)));
        const bound = UNIT_ROUNDOFF * Math.abs(toNumber(exact)) + gamma(n) ** 2 * absDot;
        expect(err).toBeLessThanOrEqual(bound);
      }
    }
    expect(Math.min(...conditions)).toBeLessThan(1e7);
    expect(Math.max(...conditions)).toBeGreaterThan(1e35);
  });

  it('is far more accurate than plain summation on ill-conditioned cases', () => {
    const rand = mulberry32(11);
    const n = 40;
    for (let trial = 0; trial < 5; trial++) {
      const { x, y, exact, absDot } = illConditionedDot(n, 40, rand); // condition about 2^80
      const exactValue = toNumber(exact);
      const condition = (2 * absDot) / Math.abs(exactValue);
      expect(condition).toBeGreaterThan(1e20);
      expect(condition).toBeLessThan(1e28);
      let plain = 0;
      for (let i = 0; i < n; i++) plain += x[i]! * y[i]!;
      const relPlain = Math.abs(plain - exactValue) / Math.abs(exactValue);
      const relDot2 = Math.abs(dot2(n, x, 0, 1, y, 0, 1) - exactValue) / Math.abs(exactValue);
      // With condition ≥ 1e20 plain summation loses every digit (error ≈ u·condition);
      // Dot2's bound u + γ_n²·condition/2 is below 1e-3 for condition < 1e28 and n = 40.
      expect(relPlain).toBeGreaterThan(1e-2);
      expect(relDot2).toBeLessThan(1e-3);
    }
  });

  it('honours offsets and strides (a column of a row-major matrix)', () => {
    // Column 1 of the 3×2 matrix [[1, 2], [3, 4], [5, 6]] dotted with (1, 10, 100): 2 + 40 + 600.
    const a = Float64Array.from([1, 2, 3, 4, 5, 6]);
    expect(dot2(3, a, 1, 2, [1, 10, 100], 0, 1)).toBe(642);
    expect(dot2(0, a, 0, 1, a, 0, 1)).toBe(0);
  });
});
