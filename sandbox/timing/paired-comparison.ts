import type { TimingVerdict } from '@shared/routines.ts';
import { benjaminiHochberg } from '@sandbox/stats/benjamini-hochberg.ts';
import { hodgesLehmannOneSample } from '@sandbox/stats/hodges-lehmann.ts';
import { wilcoxonSignedRank } from '@sandbox/stats/wilcoxon-signed-rank.ts';
import { summariseTimes, type TimeSummary } from '@sandbox/timing/time-summary.ts';

/**
 * The paired comparison of a candidate's and an incumbent's per-round times (numerics.md, "Timing";
 * numerics-references §8.2–8.4). Rounds are interleaved, so round r's two times share the machine's
 * state: work on the log-ratios d_r = ln(c_r/i_r), estimate their centre with Hodges–Lehmann (median
 * of Walsh averages) and bound it with the Wilcoxon signed-rank interval, then map back with exp(·):
 * exp(Δ̂) estimates the time ratio candidate/incumbent, assuming a multiplicative effect.
 */

export interface ComparisonOptions {
  /** Practical margin: a change smaller than this factor is not reported (default 0.03 = 3 %). */
  margin?: number;
  /** Confidence of the interval; 1 − confidence is also the BH false discovery rate (default 0.95). */
  confidence?: number;
}

export interface PairedSample {
  candidateMs: readonly number[];
  incumbentMs: readonly number[];
}

export interface PairedComparison {
  rounds: number;
  /** Minimum, quartiles and median of each side's times (null with no rounds). */
  candidate: TimeSummary | null;
  incumbent: TimeSummary | null;
  /** exp(HL estimate of the log-ratios): > 1 means the candidate takes longer. Null with no rounds. */
  ratio: number | null;
  /** [exp(W_(k)), exp(W_(M+1−k))]; null when there are too few rounds for the confidence. */
  ci95: [number, number] | null;
  /** Two-sided signed-rank p-value of the log-ratios (null with no rounds). */
  pValue: number | null;
  /** Benjamini–Hochberg adjusted p-value across the sizes compared together. */
  pValueAdjusted: number | null;
  verdict: TimingVerdict;
}

/**
 * The verdict rule of numerics.md: 'slower' / 'faster' only when the interval excludes 1, the
 * estimate lies beyond the practical margin (symmetric in logs: ratio > 1 + margin, or
 * ratio < 1/(1 + margin)) and the test survives the false-discovery-rate control; otherwise
 * 'no clear difference'. The margin rule follows numerics-references §8.4 (common practice).
 */
export function timingVerdict(
  ratio: number | null,
  ci: readonly [number, number] | null,
  margin: number,
  significant: boolean,
): TimingVerdict {
  if (ratio === null || ci === null || !significant) return 'no clear difference';
  if (ci[0] > 1 && ratio > 1 + margin) return 'slower';
  if (ci[1] < 1 && ratio < 1 / (1 + margin)) return 'faster';
  return 'no clear difference';
}

/**
 * The per-round log-ratios ln(c_r) − ln(i_r) of one paired sample. Throws RangeError on unequal
 * lengths or a time that is not positive and finite (`index` names the sample in the message).
 */
export function pairedLogRatios(sample: PairedSample, index = 0): number[] {
  const { candidateMs, incumbentMs } = sample;
  if (candidateMs.length !== incumbentMs.length) {
    throw new RangeError(`samples[${index}]: candidateMs and incumbentMs must have equal lengths`);
  }
  return candidateMs.map((c, r) => {
    const i = incumbentMs[r]!;
    if (!(c > 0 && Number.isFinite(c) && i > 0 && Number.isFinite(i))) {
      throw new RangeError(`samples[${index}], round ${r}: times must be positive and finite`);
    }
    return Math.log(c) - Math.log(i);
  });
}

/** The location estimate and its test for one sample of log-ratios (one size). */
export interface LogRatioComparison {
  /** exp(HL estimate of the log-ratios); null for an empty sample. */
  ratio: number | null;
  /** [exp(W_(k)), exp(W_(M+1−k))]; null when the sample is too small for the confidence. */
  ci95: [number, number] | null;
  /** Two-sided signed-rank p-value (null for an empty sample). */
  pValue: number | null;
  pValueAdjusted: number | null;
  verdict: TimingVerdict;
}

/** Throws RangeError when the margin or the confidence is out of range; returns both. */
export function checkComparisonOptions(options: ComparisonOptions): Required<ComparisonOptions> {
  const { margin = 0.03, confidence = 0.95 } = options;
  if (!(margin >= 0 && Number.isFinite(margin)))
    throw new RangeError(`margin must be ≥ 0, got ${margin}`);
  if (!(confidence > 0 && confidence < 1)) {
    throw new RangeError(`confidence must lie in (0, 1), got ${confidence}`);
  }
  return { margin, confidence };
}

/**
 * The comparison of several sizes from one sample of log-ratios ln(candidate/incumbent) each
 * (paired rounds, or one estimate per block of rounds): per size the HL estimate, its signed-rank
 * interval and two-sided p-value; across sizes the Benjamini–Hochberg adjustment at rate
 * 1 − confidence; then the verdict. Cost O(L² log L) per size of L log-ratios. Throws RangeError
 * on a non-finite log-ratio or a margin or confidence out of range.
 */
export function compareLogRatios(
  samples: readonly (readonly number[])[],
  options: ComparisonOptions = {},
): LogRatioComparison[] {
  const { margin, confidence } = checkComparisonOptions(options);
  const partial = samples.map((d) => {
    if (d.length === 0) return { ratio: null, ci95: null, pValue: null };
    const hl = hodgesLehmannOneSample(d, { confidence });
    const ci95: [number, number] | null =
      hl.k === 0 ? null : [Math.exp(hl.lower), Math.exp(hl.upper)];
    return { ratio: Math.exp(hl.estimate), ci95, pValue: wilcoxonSignedRank(d).pValue };
  });
  const tested = partial.filter((p) => p.pValue !== null).map((p) => p.pValue!);
  const { adjusted } = benjaminiHochberg(tested, 1 - confidence);
  let next = 0;
  return partial.map((p) => {
    const pValueAdjusted = p.pValue === null ? null : adjusted[next++]!;
    const significant = pValueAdjusted !== null && pValueAdjusted <= 1 - confidence;
    return { ...p, pValueAdjusted, verdict: timingVerdict(p.ratio, p.ci95, margin, significant) };
  });
}

/**
 * Compare several sizes at once on their paired rounds: compareLogRatios on the per-round
 * log-ratios, with each side's time summary. Cost O(R² log R) per size for R rounds. Throws
 * RangeError on unequal lengths, non-positive or non-finite times, or a margin or confidence out
 * of range.
 */
export function compareTimings(
  samples: readonly PairedSample[],
  options: ComparisonOptions = {},
): PairedComparison[] {
  checkComparisonOptions(options);
  const logs = samples.map((sample, index) => pairedLogRatios(sample, index));
  const compared = compareLogRatios(logs, options);
  return samples.map((sample, i) => {
    const empty = logs[i]!.length === 0;
    return {
      rounds: logs[i]!.length,
      candidate: empty ? null : summariseTimes(sample.candidateMs),
      incumbent: empty ? null : summariseTimes(sample.incumbentMs),
      ...compared[i]!,
    };
  });
}

/** One size on its own (the BH adjustment of a single p-value is the identity). */
export function comparePaired(
  candidateMs: readonly number[],
  incumbentMs: readonly number[],
  options: ComparisonOptions = {},
): PairedComparison {
  return compareTimings([{ candidateMs, incumbentMs }], options)[0]!;
}
