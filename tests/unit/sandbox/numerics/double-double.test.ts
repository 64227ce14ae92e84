import { describe, expect, it } from 'vitest';
import {
  ddAdd,
  ddDiv,
  ddMul,
  ddSub,
  ddSubScaledInPlace,
  fastTwoSum,
} from '@sandbox/numerics/double-double.ts';
import { twoSum } from '@sandbox/numerics/error-free.ts';
import {
  type Rational,
  abs,
  add,
  div,
  equals,
  fromDouble,
  mul,
  sub,
  toNumber,
} from '@tests/helpers/rational.ts';
import { mulberry32 } from '@tests/helpers/seeded-random.ts';

/** A normalised double-double: hi random over exponents ±e, lo a random fraction of ulp(hi)/2. */
function randomDd(rand: () => number, e: number): [number, number] {
  const hi = (rand() < 0.5 ? -1 : 1) * (1 + rand()) * 2 ** Math.round((2 * rand() - 1) * e);
  const [h, l] = twoSum(hi, (2 * rand() - 1) * hi * 2 ** -53);
  return [h, l];
}

const U2 = 2 ** -106; // u², u = 2^-53
const value = (h: number, l: number): Rational => add(fromDouble(h), fromDouble(l));

/** |computed − exact| / |exact|, evaluated exactly and rounded at the end. */
function relativeError(computed: [number, number], exact: Rational): number {
  return toNumber(div(abs(sub(value(...computed), exact)), abs(exact)));
}

/** The pair is normalised: hi = fl(hi + lo), i.e. |lo| ≤ ulp(hi)/2. */
function expectNormalised([h, l]: [number, number]): void {
  expect(h + l).toBe(h);
}

describe('fastTwoSum (Dekker 1971)', () => {
  it('is exact when |a| ≥ |b|', () => {
    const rand = mulberry32(1);
    for (let k = 0; k < 500; k++) {
      const a = (1 + rand()) * 2 ** 10;
      const b = (2 * rand() - 1) * 2 ** (10 - 60 * rand());
      const [s, e] = fastTwoSum(a, b);
      expect(s).toBe(a + b);
      expect(equals(value(s, e), add(fromDouble(a), fromDouble(b)))).toBe(true);
    }
  });

  it('loses the error term when the precondition |a| ≥ |b| is violated', () => {
    // 2^-60 + 1: s = 1, and the error 2^-60 is lost (numerics-references §6.1 notes the
    // precondition; Dekker 1971).
    expect(fastTwoSum(2 ** -60, 1)).toEqual([1, 0]);
    expect(fastTwoSum(1, 2 ** -60)).toEqual([1, 2 ** -60]);
  });
});

describe('double-double arithmetic (Dekker 1971; Hida, Li & Bailey 2001)', () => {
  // Bound used for all four operations: 4u² relative. Published analyses give about 3u² for
  // this add and a few u² for mul and div (Joldes, Muller & Popescu, ACM TOMS 44 (2017), from
  // memory). Observed maxima here are below 1.5u²; an error in the algorithm shows as ~u.
  const bound = 4 * U2;

  it('ddAdd and ddSub: relative error ≤ 4u² against the exact sum, normalised results', () => {
    const rand = mulberry32(2);
    for (let k = 0; k < 1000; k++) {
      const [ah, al] = randomDd(rand, 30);
      const [bh, bl] = randomDd(rand, 30);
      const s = ddAdd(ah, al, bh, bl);
      expect(relativeError(s, add(value(ah, al), value(bh, bl)))).toBeLessThanOrEqual(bound);
      expectNormalised(s);
      const d = ddSub(ah, al, bh, bl);
      expect(relativeError(d, sub(value(ah, al), value(bh, bl)))).toBeLessThanOrEqual(bound);
    }
  });

  it('ddAdd stays accurate under heavy cancellation (where the "sloppy" add fails)', () => {
    // (1 + 2^-60) + (−1 + 2^-70) = 2^-60 + 2^-70 exactly representable as a double-double.
    expect(ddAdd(1, 2 ** -60, -1, 2 ** -70)).toEqual([2 ** -60 + 2 ** -70, 0]);
    // Near-equal operands from random draws: still within the bound.
    const rand = mulberry32(3);
    for (let k = 0; k < 300; k++) {
      const [ah, al] = randomDd(rand, 5);
      const [bh, bl] = twoSum(-ah, (2 * rand() - 1) * ah * 2 ** -40);
      const exact = add(value(ah, al), value(bh, bl));
      if (exact.num === 0n) continue;
      expect(relativeError(ddAdd(ah, al, bh, bl), exact)).toBeLessThanOrEqual(bound);
    }
  });

  it.each([
    ['ddMul', 'product', ddMul, mul, 4],
    ['ddDiv', 'quotient', ddDiv, div, 5],
  ] as const)('%s: relative error ≤ 4u² against the exact %s', (_, __, op, exact, seed) => {
    const rand = mulberry32(seed);
    for (let k = 0; k < 1000; k++) {
      const [ah, al] = randomDd(rand, 100);
      const [bh, bl] = randomDd(rand, 100);
      const r = op(ah, al, bh, bl);
      expect(relativeError(r, exact(value(ah, al), value(bh, bl)))).toBeLessThanOrEqual(bound);
      expectNormalised(r);
    }
  });

  it('ddDiv: relative error ≤ 4u² for 1/3 and 1/10, which no double holds exactly', () => {
    expect(relativeError(ddDiv(1, 0, 3, 0), { num: 1n, den: 3n })).toBeLessThanOrEqual(bound);
    expect(relativeError(ddDiv(1, 0, 10, 0), { num: 1n, den: 10n })).toBeLessThanOrEqual(bound);
    expect(relativeError(ddDiv(1, 0, 3, 0), { num: 1n, den: 3n })).toBeGreaterThan(0);
  });

  it('ddDiv by zero gives a non-finite high part', () => {
    expect(Number.isFinite(ddDiv(1, 0, 0, 0)[0])).toBe(false);
  });

  it('ddSubScaledInPlace equals ddSub(y, ddMul(s, x)) bit for bit, with offsets', () => {
    const rand = mulberry32(6);
    const len = 40;
    const yHi = new Float64Array(len + 3);
    const yLo = new Float64Array(len + 3);
    const xHi = new Float64Array(len + 5);
    const xLo = new Float64Array(len + 5);
    for (let j = 0; j < len + 5; j++) {
      if (j < len + 3) [yHi[j], yLo[j]] = randomDd(rand, 20);
      [xHi[j], xLo[j]] = randomDd(rand, 20);
    }
    const [sh, sl] = randomDd(rand, 3);
    const expected: [number, number][] = [];
    for (let j = 0; j < len; j++)
      expected.push(ddSub(yHi[3 + j]!, yLo[3 + j]!, ...ddMul(sh, sl, xHi[5 + j]!, xLo[5 + j]!)));
    const before = [yHi[0], yHi[1], yHi[2]];
    ddSubScaledInPlace(yHi, yLo, 3, xHi, xLo, 5, len, sh, sl);
    for (let j = 0; j < len; j++) expect([yHi[3 + j], yLo[3 + j]]).toEqual(expected[j]);
    expect([yHi[0], yHi[1], yHi[2]]).toEqual(before); // entries before the offset untouched
  });
});
