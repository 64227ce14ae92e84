import type { RoutineSlug, TimingVerdict } from '@shared/routines.ts';
import { gflops } from '@sandbox/timing/flops.ts';
import { timeOneSize, type RawSizeTiming } from '@sandbox/timing/interleaved-size.ts';
import { compareTimings, type ComparisonOptions } from '@sandbox/timing/paired-comparison.ts';
import { isStuckSlow, STUCK_SLOW_FACTOR } from '@sandbox/timing/stuck-slow.ts';
import type { KernelRole, TimedKernel, TimingFailure } from '@sandbox/timing/timed-kernel.ts';
import { summariseTimes, type TimeSummary } from '@sandbox/timing/time-summary.ts';

// The kernel interface belongs with the function that calls it; it is defined beside its call types.
export type { TimedCall, TimedKernel } from '@sandbox/timing/timed-kernel.ts';

/**
 * Interleaved timing of a candidate against the incumbent over several sizes, with the paired
 * comparison per size and the Benjamini–Hochberg control across sizes (numerics.md, "Timing").
 */

/**
 * Default time for one size's timed rounds (common practice): a warm LU call at n = 128 takes
 * about 0.85 ms (stack.md), so 1 s buys the maximum of 201 rounds there; calls of about 45 ms or
 * more get the minimum of 11 rounds, which then take longer than the budget.
 */
export const DEFAULT_SIZE_BUDGET_MS = 1000;

export type TimingFlag =
  'candidate-stuck-slow' | 'incumbent-stuck-slow' | 'candidate-failed' | 'incumbent-failed';

export interface KernelTiming extends TimeSummary {
  /** GFLOP/s at the median time, with the leading-term flop count of the routine. */
  gflops: number;
}

export interface SizeTiming {
  n: number;
  /** Completed timed rounds. */
  rounds: number;
  /** Null when the kernel completed no timed round at this size (it failed in warm-up). */
  candidate: KernelTiming | null;
  /** Null without an incumbent, or when it completed no timed round. */
  incumbent: KernelTiming | null;
  /** HL estimate of candidate time / incumbent time; null without an incumbent or after a failure. */
  ratio: number | null;
  ci95: [number, number] | null;
  pValue: number | null;
  pValueAdjusted: number | null;
  /** Null without an incumbent or after a failure. */
  verdict: TimingVerdict | null;
  flags: TimingFlag[];
  failure: TimingFailure | null;
}

export interface TimingProgress {
  sizeIndex: number;
  sizeCount: number;
  n: number;
  phase: 'warm-up' | 'timing' | 'done';
  round: number;
  rounds: number;
}

export interface InterleavedTimingOptions<TInput> extends ComparisonOptions {
  sizes: readonly number[];
  /** The routine, for the flop counts behind GFLOP/s. */
  routine: RoutineSlug;
  /** Rows m for size n (QR); default m = n. */
  rows?: (n: number) => number;
  candidate: TimedKernel<TInput>;
  incumbent?: TimedKernel<TInput> | null;
  /** A fresh copy of the same input for size n on every call. */
  makeInput: (n: number) => TInput;
  /** Time for the timed rounds of each size, in ms (default DEFAULT_SIZE_BUDGET_MS). */
  budgetMs?: number;
  /** Warm-up calls per kernel and size; default chosen from the first call (rounds.ts). */
  warmup?: number;
  minRounds?: number;
  maxRounds?: number;
  stuckSlowFactor?: number;
  onProgress?: (progress: TimingProgress) => void;
}

function kernelTiming(
  ms: number[],
  routine: RoutineSlug,
  m: number,
  n: number,
): KernelTiming | null {
  if (ms.length === 0) return null;
  const summary = summariseTimes(ms);
  return { ...summary, gflops: gflops(routine, m, n, summary.medianMs) };
}

function flagsOf(raw: RawSizeTiming, factor: number): TimingFlag[] {
  const flags: TimingFlag[] = [];
  for (const role of ['candidate', 'incumbent'] as const satisfies KernelRole[]) {
    if (isStuckSlow(raw.warmMs[role].slice(1), raw.roundMs[role], factor))
      flags.push(`${role}-stuck-slow`);
  }
  if (raw.failure) flags.push(`${raw.failure.kernel}-failed`);
  return flags;
}

function checkOptions<TInput>(options: InterleavedTimingOptions<TInput>): void {
  const { sizes, budgetMs = DEFAULT_SIZE_BUDGET_MS, warmup } = options;
  if (sizes.length === 0) throw new RangeError('sizes must not be empty');
  sizes.forEach((n, i) => {
    if (!Number.isInteger(n) || n < 1)
      throw new RangeError(`sizes[${i}] must be a positive integer, got ${n}`);
  });
  if (!(budgetMs >= 0 && Number.isFinite(budgetMs))) {
    throw new RangeError(`budgetMs must be ≥ 0 and finite, got ${budgetMs}`);
  }
  if (warmup !== undefined && !(Number.isInteger(warmup) && warmup >= 1)) {
    throw new RangeError(`warmup must be a positive integer, got ${warmup}`);
  }
  const factor = options.stuckSlowFactor ?? STUCK_SLOW_FACTOR;
  if (!(factor > 1 && Number.isFinite(factor))) {
    throw new RangeError(`stuckSlowFactor must exceed 1, got ${factor}`);
  }
  // Check margin and confidence before spending time on measurements: an empty comparison
  // validates them and compares nothing.
  compareTimings([], options);
}

/**
 * Time candidate (and incumbent, if any) at each size: warm-up, then R interleaved rounds on fresh
 * inputs (interleaved-size.ts), R from the budget (rounds.ts); summarise each side, compare the
 * pairs (paired-comparison.ts, BH across the sizes with an incumbent and no failure) and flag a
 * kernel stuck slow or failed. Sizes run one after another, in the given order.
 * Throws RangeError on bad options; a failed kernel call is reported, not thrown.
 */
export async function runInterleavedTiming<TInput>(
  options: InterleavedTimingOptions<TInput>,
): Promise<SizeTiming[]> {
  checkOptions(options);
  const { sizes, routine, rows = (n: number) => n, incumbent = null, onProgress } = options;
  const raws: RawSizeTiming[] = [];
  for (const [sizeIndex, n] of sizes.entries()) {
    const report = (phase: TimingProgress['phase'], round: number, rounds: number) =>
      onProgress?.({ sizeIndex, sizeCount: sizes.length, n, phase, round, rounds });
    report('warm-up', 0, 0);
    const raw = await timeOneSize({
      n,
      candidate: options.candidate,
      incumbent,
      makeInput: options.makeInput,
      budgetMs: options.budgetMs ?? DEFAULT_SIZE_BUDGET_MS,
      warmup: options.warmup,
      minRounds: options.minRounds,
      maxRounds: options.maxRounds,
      onRound: (round, rounds) => report('timing', round, rounds),
    });
    raws.push(raw);
    report('done', raw.roundMs.candidate.length, raw.plannedRounds);
  }
  const compared = raws.map((raw) => incumbent !== null && raw.failure === null);
  const comparisons = compareTimings(
    raws
      .filter((_, i) => compared[i])
      .map((raw) => ({ candidateMs: raw.roundMs.candidate, incumbentMs: raw.roundMs.incumbent })),
    options,
  );
  let next = 0;
  return raws.map((raw, i) => {
    const n = sizes[i]!;
    const m = rows(n);
    const c = compared[i] ? comparisons[next++]! : null;
    return {
      n,
      rounds: raw.roundMs.candidate.length,
      candidate: kernelTiming(raw.roundMs.candidate, routine, m, n),
      incumbent: kernelTiming(raw.roundMs.incumbent, routine, m, n),
      ratio: c?.ratio ?? null,
      ci95: c?.ci95 ?? null,
      pValue: c?.pValue ?? null,
      pValueAdjusted: c?.pValueAdjusted ?? null,
      verdict: c?.verdict ?? null,
      flags: flagsOf(raw, options.stuckSlowFactor ?? STUCK_SLOW_FACTOR),
      failure: raw.failure,
    };
  });
}
