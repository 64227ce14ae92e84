import { hodgesLehmannOneSample } from '@sandbox/stats/hodges-lehmann.ts';
import { median } from '@sandbox/stats/quantiles.ts';
import {
  compareLogRatios,
  pairedLogRatios,
  type ComparisonOptions,
  type LogRatioComparison,
  type PairedSample,
} from '@sandbox/timing/paired-comparison.ts';

/**
 * The comparison across blocks. Each block times the two kernels in fresh isolates, and two
 * isolates of the same source can settle on code a few per cent apart for their whole life
 * (measured: benchmarks/README.md, timing-calibration), so the isolate is a random effect and the
 * rounds of one block are not independent evidence about the kernels. Following Kalibera & Jones
 * ("Rigorous benchmarking in reasonable time", ISMM 2013) and Georges, Buytaert & Eeckhout
 * ("Statistically rigorous Java performance evaluation", OOPSLA 2007): reduce each block to one
 * estimate (the HL estimate of its per-round log-ratios), and bound the ratio with the spread
 * between blocks, which contains both the isolate's and the rounds' share. The B block estimates
 * are independent; under "no difference" each is symmetric about 0 (the two kernels are
 * exchangeable: load order and call order alternate from block to block), which is what the
 * signed-rank interval and test need (Hollander, Wolfe & Chicken, 3rd ed., 2014, §3.1–3.3, from
 * memory).
 */

/** Scale of the MAD that makes it a consistent estimate of a normal sd: 1/Φ⁻¹(¾) (common practice). */
export const MAD_TO_SD = 1.482602218505602;

export interface BlockComparison extends LogRatioComparison {
  /** Blocks that timed at least one round. */
  blocks: number;
  roundsPerBlock: number[];
  /** exp(per-block HL estimate), block by block. */
  blockRatios: number[];
  /** MAD_TO_SD × MAD of the per-block log estimates (null with fewer than 2 blocks). */
  betweenBlockSpread: number | null;
  /**
   * MAD_TO_SD × median |d_r − block estimate| over the rounds of blocks with at least 2 rounds
   * (null when there are none).
   */
  roundSpread: number | null;
}

/** MAD_TO_SD × median |x − median x|; null for fewer than `least` values. */
function robustSpread(values: readonly number[], least: number): number | null {
  if (values.length < least) return null;
  const centre = median(values);
  return MAD_TO_SD * median(values.map((v) => Math.abs(v - centre)));
}

/**
 * Compare several sizes at once, each given as its blocks of paired rounds: per block the HL
 * estimate of its log-ratios, then compareLogRatios across the blocks' estimates (HL estimate,
 * exact signed-rank interval and p-value for up to 50 blocks, Benjamini–Hochberg across sizes,
 * margin rule). Blocks without a round are left out. With B blocks the smallest two-sided exact
 * p-value is 2/2^B and the 95 % interval needs B ≥ 6, so fewer blocks never give a verdict.
 * Cost O(Σ R_b² log R_b + B² log B) per size. Throws RangeError like compareTimings.
 */
export function compareBlocks(
  sizes: readonly (readonly PairedSample[])[],
  options: ComparisonOptions = {},
): BlockComparison[] {
  const perSize = sizes.map((blocks, index) => {
    const estimates: number[] = [];
    const roundsPerBlock: number[] = [];
    const deviations: number[] = [];
    for (const block of blocks) {
      const d = pairedLogRatios(block, index);
      if (d.length === 0) continue;
      const estimate = hodgesLehmannOneSample(d).estimate;
      estimates.push(estimate);
      roundsPerBlock.push(d.length);
      // A single round equals its block's estimate and says nothing about the round noise.
      if (d.length > 1) for (const v of d) deviations.push(v - estimate);
    }
    return { estimates, roundsPerBlock, deviations };
  });
  const compared = compareLogRatios(
    perSize.map((s) => s.estimates),
    options,
  );
  return perSize.map((s, i) => ({
    ...compared[i]!,
    blocks: s.estimates.length,
    roundsPerBlock: s.roundsPerBlock,
    blockRatios: s.estimates.map(Math.exp),
    betweenBlockSpread: robustSpread(s.estimates, 2),
    roundSpread:
      s.deviations.length === 0 ? null : MAD_TO_SD * median(s.deviations.map((v) => Math.abs(v))),
  }));
}
