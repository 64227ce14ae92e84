import { describe, expect, it } from 'vitest';
import { hodgesLehmannOneSample, hodgesLehmannTwoSample } from '@sandbox/stats/hodges-lehmann.ts';
import { mulberry32 } from '@tests/helpers/seeded-random.ts';

describe('hodgesLehmannTwoSample', () => {
  it('timing example: ratio 1.0629987, 95 % CI [1.0361570, 1.0950888] (§8.5)', () => {
    const tA = [1.021, 1.003, 1.048, 0.991, 1.012, 1.197, 1.034, 1.006];
    const tB = [0.951, 0.932, 0.962, 0.973, 0.944, 1.102, 0.957, 0.968];
    const hl = hodgesLehmannTwoSample(tA.map(Math.log), tB.map(Math.log));
    expect(Math.exp(hl.estimate)).toBeCloseTo(1.0629987, 7);
    expect(Math.exp(hl.lower)).toBeCloseTo(1.036157, 7);
    expect(Math.exp(hl.upper)).toBeCloseTo(1.0950888, 7);
    expect(hl.k).toBe(14);
    expect(hl.coverage).toBeCloseTo(0.9501166, 7);
  });

  it('estimates a planted shift', () => {
    const y = [3.1, 0.4, 2.2, 5.0, 1.7];
    const x = y.map((v) => v + 10);
    const hl = hodgesLehmannTwoSample(x, y);
    expect(hl.estimate).toBe(10);
    expect(hl.lower).toBeLessThanOrEqual(10);
    expect(hl.upper).toBeGreaterThanOrEqual(10);
  });
});

describe('hodgesLehmannOneSample', () => {
  it('is the median of the Walsh averages, with [W_(k), W_(M+1−k)] (hand-worked, n = 6)', () => {
    // n = 6: k = 1 (P(T⁺ = 0) = 1/64 ≤ 0.025), so the interval spans min and max of the Walsh
    // averages, which are min(d) and max(d).
    const d = [0.2, -0.1, 0.5, 0.3, 0.9, 0.4];
    const hl = hodgesLehmannOneSample(d);
    expect(hl.k).toBe(1);
    expect(hl.lower).toBe(-0.1);
    expect(hl.upper).toBe(0.9);
    // 21 Walsh averages; hand count gives the 11th smallest = 0.35.
    expect(hl.estimate).toBeCloseTo(0.35, 15);
  });

  it('gives an infinite interval when n is too small for the confidence', () => {
    const hl = hodgesLehmannOneSample([1, 2, 3]);
    expect(hl.lower).toBe(-Infinity);
    expect(hl.upper).toBe(Infinity);
    expect(hl.estimate).toBe(2);
  });

  it('has the exact coverage 1 − 2P(T⁺ ≤ k − 1) on symmetric data (seeded simulation)', () => {
    // n = 10 → coverage 0.951171875 (signed-rank table, from memory). 3000 seeded samples of a
    // symmetric, heavy-tailed law (difference of two exponentials, centre 0.3); the hit rate must
    // lie within 4 standard errors (4·√(0.95·0.05/3000) ≈ 0.016) of the exact coverage.
    const next = mulberry32(20240611);
    let hits = 0;
    const repeats = 3000;
    for (let r = 0; r < repeats; r++) {
      const d = Array.from({ length: 10 }, () => 0.3 + Math.log(next()) - Math.log(next()));
      const hl = hodgesLehmannOneSample(d);
      if (hl.lower <= 0.3 && 0.3 <= hl.upper) hits++;
    }
    expect(Math.abs(hits / repeats - 0.951171875)).toBeLessThan(0.016);
  });

  it('rejects empty data and a bad confidence', () => {
    expect(() => hodgesLehmannOneSample([])).toThrow(/d must not be empty/);
    expect(() => hodgesLehmannOneSample([1, 2], { confidence: 1 })).toThrow(/confidence/);
  });
});
