import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '@sandbox/stats/benjamini-hochberg.ts';
import { compareBlocks, MAD_TO_SD } from '@sandbox/timing/block-comparison.ts';
import { comparePaired, type PairedSample } from '@sandbox/timing/paired-comparison.ts';
import { seededNormal } from '@tests/helpers/seeded-random.ts';

/**
 * Reference values by exact enumeration in the test, independent of the engine's dynamic
 * programming: the 2^B equally likely sign patterns of the ranks 1..B give the null distribution
 * of the signed-rank statistic T⁺ (Wilcoxon 1945; Hollander, Wolfe & Chicken, 3rd ed., 2014,
 * §3.1, from memory), and the Walsh averages are listed pair by pair.
 */
function signedRankNull(b: number): number[] {
  const counts = new Array<number>((b * (b + 1)) / 2 + 1).fill(0);
  for (let mask = 0; mask < 2 ** b; mask++) {
    let t = 0;
    for (let r = 1; r <= b; r++) if (mask & (1 << (r - 1))) t += r;
    counts[t]! += 1;
  }
  return counts.map((c) => c / 2 ** b);
}

const below = (p: number[], t: number) => p.slice(0, t + 1).reduce((s, v) => s + v, 0);

/** Two-sided exact p-value of untied, non-zero d: 2·min(P(T⁺ ≤ t), P(T⁺ ≥ t)), at most 1. */
function enumeratedPValue(d: number[]): number {
  const p = signedRankNull(d.length);
  const order = [...d].map(Math.abs).sort((x, y) => x - y);
  const t = d.filter((v) => v > 0).reduce((s, v) => s + order.indexOf(Math.abs(v)) + 1, 0);
  return Math.min(1, 2 * Math.min(below(p, t), 1 - below(p, t - 1)));
}

function walshSorted(d: number[]): number[] {
  const w: number[] = [];
  for (let i = 0; i < d.length; i++) for (let j = i; j < d.length; j++) w.push((d[i]! + d[j]!) / 2);
  return w.sort((x, y) => x - y);
}

const middle = (sorted: number[]) =>
  sorted.length % 2 === 1
    ? sorted[(sorted.length - 1) / 2]!
    : (sorted[sorted.length / 2 - 1]! + sorted[sorted.length / 2]!) / 2;

/** One-round blocks whose log-ratios are exactly d (candidate e^d, incumbent 1). */
const oneRoundBlocks = (d: number[]): PairedSample[] =>
  d.map((v) => ({ candidateMs: [Math.exp(v)], incumbentMs: [1] }));

describe('the exact signed-rank distribution for 8 blocks', () => {
  it('matches the published table: P(T⁺ ≥ 33) = .020, P(T⁺ ≥ 32) = .027', () => {
    // Hollander & Wolfe, Nonparametric Statistical Methods, Table A.4, n = 8 (from memory);
    // the enumeration gives 5/256 and 7/256.
    const p = signedRankNull(8);
    expect(1 - below(p, 32)).toBeCloseTo(5 / 256, 15);
    expect(1 - below(p, 31)).toBeCloseTo(7 / 256, 15);
    expect(5 / 256).toBeCloseTo(0.02, 3);
    expect(7 / 256).toBeCloseTo(0.027, 3);
  });
});

describe('compareBlocks against exact enumeration', () => {
  // Invented block estimates (log-ratios), distinct magnitudes, six of eight positive.
  const d = [0.052, -0.011, 0.037, 0.064, 0.021, -0.006, 0.045, 0.029];

  it('estimates the ratio by the median Walsh average of the block estimates', () => {
    const [c] = compareBlocks([oneRoundBlocks(d)]);
    expect(c!.ratio).toBeCloseTo(Math.exp(middle(walshSorted(d))), 14);
    expect(c!.blocks).toBe(8);
    expect(c!.roundsPerBlock).toEqual([1, 1, 1, 1, 1, 1, 1, 1]);
    d.forEach((v, i) => expect(c!.blockRatios[i]).toBeCloseTo(Math.exp(v), 14));
  });

  it('bounds it by [W_(k), W_(M+1−k)] with k from the enumerated null distribution', () => {
    const p = signedRankNull(8);
    let k = 0;
    while (below(p, k) <= 0.025) k++; // largest k with P(T⁺ ≤ k − 1) ≤ α/2
    expect(k).toBe(4);
    const w = walshSorted(d);
    const [c] = compareBlocks([oneRoundBlocks(d)]);
    expect(c!.ci95![0]).toBeCloseTo(Math.exp(w[k - 1]!), 14);
    expect(c!.ci95![1]).toBeCloseTo(Math.exp(w[w.length - k]!), 14);
  });

  it('gives the exact two-sided p-value, 2/2⁸ when every block points the same way', () => {
    const [mixed] = compareBlocks([oneRoundBlocks(d)]);
    expect(mixed!.pValue).toBeCloseTo(enumeratedPValue(d), 14);
    const allUp = d.map(Math.abs);
    const [up] = compareBlocks([oneRoundBlocks(allUp)]);
    expect(up!.pValue).toBeCloseTo(2 / 256, 15);
    expect(up!.pValue).toBeLessThan(0.05 / 6); // survives BH over six sizes on its own
    expect(up!.verdict).toBe('slower');
  });

  it('reduces each block to the HL estimate of its own rounds', () => {
    // Invented: three rounds in each of 8 blocks.
    const z = seededNormal(5);
    const blocks: PairedSample[] = Array.from({ length: 8 }, () => ({
      candidateMs: [1, 2, 3].map(() => Math.exp(0.1 + 0.02 * z())),
      incumbentMs: [1, 2, 3].map(() => Math.exp(0.02 * z())),
    }));
    const [c] = compareBlocks([blocks]);
    blocks.forEach((b, i) => {
      const rounds = b.candidateMs.map((x, r) => Math.log(x) - Math.log(b.incumbentMs[r]!));
      expect(Math.log(c!.blockRatios[i]!)).toBeCloseTo(middle(walshSorted(rounds)), 14);
    });
  });

  it('never gives a verdict from fewer than 6 blocks (no 95 % interval exists)', () => {
    const [five] = compareBlocks([oneRoundBlocks([0.5, 0.6, 0.7, 0.8, 0.9])]);
    expect(five!.ci95).toBeNull();
    expect(five!.pValue).toBeCloseTo(2 / 32, 15);
    expect(five!.verdict).toBe('no clear difference');
  });

  it('adjusts across sizes with Benjamini–Hochberg', () => {
    const sizes = [d, d.map((v) => -v / 3), d.map(Math.abs)].map(oneRoundBlocks);
    const compared = compareBlocks(sizes);
    const { adjusted } = benjaminiHochberg(compared.map((c) => c.pValue!));
    compared.forEach((c, i) => expect(c.pValueAdjusted).toBe(adjusted[i]));
  });

  it('reports the robust spreads between blocks and of rounds within them', () => {
    // Invented: block log estimates 0, ±0.01, ±0.02, ±0.03, 0.04 → median 0, MAD 0.02.
    const e = [0, 0.01, -0.01, 0.02, -0.02, 0.03, -0.03, 0.04];
    const [c] = compareBlocks([oneRoundBlocks(e)]);
    expect(c!.betweenBlockSpread).toBeCloseTo(MAD_TO_SD * 0.02, 14);
    // One round per block says nothing about the round noise.
    expect(c!.roundSpread).toBeNull();
    // Two blocks of rounds with log-ratios {0, 0.1, 0.2} and {1, 1.1, 1.3}: estimates 0.1 and
    // 1.125 (median Walsh average), deviations {−0.1, 0, 0.1, −0.125, −0.025, 0.175}, median
    // absolute deviation 0.1.
    const [r] = compareBlocks([
      [
        { candidateMs: [0, 0.1, 0.2].map(Math.exp), incumbentMs: [1, 1, 1] },
        { candidateMs: [1, 1.1, 1.3].map(Math.exp), incumbentMs: [1, 1, 1] },
      ],
    ]);
    expect(Math.log(r!.blockRatios[1]!)).toBeCloseTo(1.125, 14);
    expect(r!.roundSpread).toBeCloseTo(MAD_TO_SD * 0.1, 12);
  });

  it('rejects unequal lengths and bad times like the paired comparison', () => {
    expect(() => compareBlocks([[{ candidateMs: [1, 2], incumbentMs: [1] }]])).toThrow(/equal/);
    expect(() => compareBlocks([[{ candidateMs: [0], incumbentMs: [1] }]])).toThrow(/positive/);
    expect(() => compareBlocks([], { confidence: 2 })).toThrow(/confidence/);
  });
});

/**
 * Synthetic trials with the isolate as a random effect (invented, seeded): every isolate runs at
 * its own lasting speed e^(0.02·z) — isolates of one source differed by a few per cent for their
 * whole life (benchmarks/README.md, timing-calibration) — and every call has 1 % noise on top.
 */
function isolateTrial(seed: number, blocks: number, rounds: number, effect: number) {
  const z = seededNormal(seed);
  return Array.from({ length: blocks }, (): PairedSample => {
    const candidate = effect * Math.exp(0.02 * z());
    const incumbent = Math.exp(0.02 * z());
    return {
      candidateMs: Array.from({ length: rounds }, () => candidate * Math.exp(0.01 * z())),
      incumbentMs: Array.from({ length: rounds }, () => incumbent * Math.exp(0.01 * z())),
    };
  });
}

describe('the isolate as a random effect (200 synthetic trials)', () => {
  it('A/A: one isolate pair judged by its rounds raises false alarms; 8 blocks do not', () => {
    let onePair = 0;
    let eightBlocks = 0;
    for (let k = 0; k < 200; k++) {
      const [single] = isolateTrial(3000 + k, 1, 160, 1);
      if (comparePaired(single!.candidateMs, single!.incumbentMs).verdict !== 'no clear difference')
        onePair++;
      const [c] = compareBlocks([isolateTrial(5000 + k, 8, 20, 1)]);
      if (c!.verdict !== 'no clear difference') eightBlocks++;
    }
    // P(|N(0, 0.02·√2)| > ln 1.03) ≈ 0.29 for one pair; the estimate over 8 blocks has about a
    // third of that sd, so beyond the margin ≈ 0.005 (normal tail; common practice).
    expect(onePair).toBeGreaterThan(30);
    expect(eightBlocks).toBeLessThanOrEqual(4);
  });

  it('a planted 10 % slowdown: slower in ≥ 95 % with 8 blocks', () => {
    let slower = 0;
    for (let k = 0; k < 200; k++) {
      const [c] = compareBlocks([isolateTrial(7000 + k, 8, 20, 1.1)]);
      if (c!.verdict === 'slower') slower++;
    }
    expect(slower).toBeGreaterThanOrEqual(190);
  });
});
