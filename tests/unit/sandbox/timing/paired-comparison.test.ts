import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '@sandbox/stats/benjamini-hochberg.ts';
import { median } from '@sandbox/stats/quantiles.ts';
import { comparePaired, compareTimings, timingVerdict } from '@sandbox/timing/paired-comparison.ts';
import { seededNormal } from '@tests/helpers/seeded-random.ts';

/**
 * Synthetic paired rounds (no real timing): a per-round machine level drifting slowly and shared by
 * both kernels, times multiplied by independent log-normal noise of the given sd, the candidate
 * additionally by `effect`. Invented test data, seeded.
 */
function syntheticRounds(seed: number, rounds: number, effect: number, noise = 0.02) {
  const z = seededNormal(seed);
  const candidateMs: number[] = [];
  const incumbentMs: number[] = [];
  let level = 5;
  for (let r = 0; r < rounds; r++) {
    level *= Math.exp(0.01 * z()); // drift that interleaving cancels
    candidateMs.push(level * effect * Math.exp(noise * z()));
    incumbentMs.push(level * Math.exp(noise * z()));
  }
  return { candidateMs, incumbentMs };
}

function verdictCounts(effect: number, repeats = 200, rounds = 31) {
  const counts = { slower: 0, faster: 0, 'no clear difference': 0 };
  for (let k = 0; k < repeats; k++) {
    const { candidateMs, incumbentMs } = syntheticRounds(1000 + k, rounds, effect);
    counts[comparePaired(candidateMs, incumbentMs).verdict]++;
  }
  return counts;
}

describe('verdict on synthetic paired samples (200 seeded repeats, 31 rounds, 2 % noise)', () => {
  it('identical distributions: no clear difference in ≥ 95 %', () => {
    expect(verdictCounts(1)['no clear difference']).toBeGreaterThanOrEqual(190);
  });

  it('a planted 10 % slowdown: slower in ≥ 95 %', () => {
    expect(verdictCounts(1.1).slower).toBeGreaterThanOrEqual(190);
  });

  it('a planted 10 % speed-up: faster in ≥ 95 %', () => {
    expect(verdictCounts(1 / 1.1).faster).toBeGreaterThanOrEqual(190);
  });

  it('a 1 % slowdown, below the 3 % margin: no clear difference in ≥ 95 %', () => {
    expect(verdictCounts(1.01)['no clear difference']).toBeGreaterThanOrEqual(190);
  });
});

describe('comparePaired', () => {
  const { candidateMs, incumbentMs } = syntheticRounds(7, 31, 1.1);

  it('brackets the ratio with its interval and summarises each side', () => {
    const result = comparePaired(candidateMs, incumbentMs);
    expect(result.rounds).toBe(31);
    expect(result.ci95![0]).toBeLessThanOrEqual(result.ratio!);
    expect(result.ratio!).toBeLessThanOrEqual(result.ci95![1]);
    expect(result.candidate!.medianMs).toBe(median(candidateMs));
    expect(result.incumbent!.q1Ms).toBeLessThanOrEqual(result.incumbent!.medianMs);
  });

  it('is antisymmetric: swapping the sides inverts ratio and interval and flips the verdict', () => {
    const forward = comparePaired(candidateMs, incumbentMs);
    const backward = comparePaired(incumbentMs, candidateMs);
    expect(forward.verdict).toBe('slower');
    expect(backward.verdict).toBe('faster');
    expect(backward.ratio!).toBeCloseTo(1 / forward.ratio!, 12);
    expect(backward.ci95![0]).toBeCloseTo(1 / forward.ci95![1], 12);
    expect(backward.pValue).toBeCloseTo(forward.pValue!, 14);
  });

  it('returns nulls for no rounds and rejects bad input', () => {
    expect(comparePaired([], [])).toMatchObject({
      rounds: 0,
      ratio: null,
      ci95: null,
      pValue: null,
    });
    expect(() => comparePaired([1, 2], [1])).toThrow(/equal lengths/);
    expect(() => comparePaired([1, 0], [1, 1])).toThrow(/positive and finite/);
    expect(() => comparePaired([1], [1], { margin: -0.1 })).toThrow(/margin/);
  });
});

describe('compareTimings across sizes', () => {
  // Invented log-ratios: size A has a real 5 % slowdown on 12 rounds (raw p ≈ 0.02); sizes B and C
  // have none. On its own A is 'slower'; with BH over three sizes its adjusted p exceeds 0.05.
  const ones = Array.from({ length: 12 }, () => 1);
  const dA = [0.1, 0.12, 0.08, 0.15, -0.02, 0.09, -0.05, 0.11, 0.07, -0.03, 0.13, -0.06];
  const dB = [0.01, -0.02, 0.015, -0.01, 0.005, -0.012, 0.02, -0.018, 0.003, -0.004, 0.011, -0.009];
  const dC = [
    0.02, -0.01, 0.013, -0.011, 0.006, -0.015, 0.018, -0.017, 0.004, -0.002, 0.01, -0.008,
  ];
  const samples = [dA, dB, dC].map((d) => ({ candidateMs: d.map(Math.exp), incumbentMs: ones }));

  it('adjusts the p-values with Benjamini–Hochberg and lets that decide', () => {
    const alone = comparePaired(samples[0]!.candidateMs, ones);
    const together = compareTimings(samples);
    const raw = together.map((t) => t.pValue!);
    const { adjusted } = benjaminiHochberg(raw);
    together.forEach((t, i) => expect(t.pValueAdjusted).toBe(adjusted[i]));
    expect(alone.pValue).toBeLessThan(0.05);
    expect(alone.verdict).toBe('slower');
    expect(together[0]!.pValueAdjusted).toBeGreaterThan(0.05);
    expect(together[0]!.verdict).toBe('no clear difference');
  });
});

describe('timingVerdict', () => {
  it('needs the interval to exclude 1, the estimate beyond the margin and significance', () => {
    expect(timingVerdict(1.1, [1.05, 1.15], 0.03, true)).toBe('slower');
    expect(timingVerdict(0.9, [0.85, 0.95], 0.03, true)).toBe('faster');
    expect(timingVerdict(1.02, [1.01, 1.03], 0.03, true)).toBe('no clear difference'); // margin
    expect(timingVerdict(1.1, [0.99, 1.2], 0.03, true)).toBe('no clear difference'); // contains 1
    expect(timingVerdict(1.1, [1.05, 1.15], 0.03, false)).toBe('no clear difference'); // BH
    expect(timingVerdict(null, null, 0.03, true)).toBe('no clear difference');
    // The margin is symmetric in logs: 1/1.03 = 0.97087…, so 0.971 is within it.
    expect(timingVerdict(0.971, [0.96, 0.98], 0.03, true)).toBe('no clear difference');
  });
});
