import type { RoutineSlug, TimingVerdict } from '@shared/routines.ts';
import { compareBlocks } from '@sandbox/timing/block-comparison.ts';
import { gflops } from '@sandbox/timing/flops.ts';
import { timeOneSize, type RawSizeTiming } from '@sandbox/timing/interleaved-size.ts';
import { compareTimings, type ComparisonOptions } from '@sandbox/timing/paired-comparison.ts';
import {
  chooseWarmup,
  chooseWarmupInWarmIsolate,
  DEFAULT_BLOCKS,
  MAX_BLOCK_ROUNDS,
  MIN_BLOCK_ROUNDS,
} from '@sandbox/timing/rounds.ts';
import { isStuckSlow, STUCK_SLOW_FACTOR } from '@sandbox/timing/stuck-slow.ts';
import type {
  DisposableTimedKernel,
  FreshKernels,
  KernelRole,
  KernelSupply,
  TimedKernel,
  TimingFailure,
} from '@sandbox/timing/timed-kernel.ts';
import { summariseTimes, type TimeSummary } from '@sandbox/timing/time-summary.ts';

// The kernel interface belongs with the function that calls it; it is defined beside its call types.
export type {
  FreshKernels,
  KernelSupply,
  TimedCall,
  TimedKernel,
} from '@sandbox/timing/timed-kernel.ts';

/**
 * Interleaved timing of a candidate against the incumbent over several sizes, in blocks: each
 * block starts a fresh kernel of each side (a new isolate) and times every size in it (warm-up,
 * then interleaved rounds); the verdict per size bounds the ratio across the blocks' estimates
 * (block-comparison.ts), with Benjamini–Hochberg across sizes (numerics.md, "Timing").
 */

/**
 * Default time for one size's timed rounds, all blocks together (common practice): a warm LU call
 * at n = 128 takes about 0.85 ms (stack.md), so 1 s buys about 25 rounds per block of 8 there;
 * calls of about 60 ms or more get the minimum of one round per block, which then takes longer
 * than the budget.
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
  /** Completed timed rounds, all blocks together. */
  rounds: number;
  /** Blocks that completed at least one timed round at this size. */
  blocks: number;
  /** Completed timed rounds of each of those blocks. */
  roundsPerBlock: number[];
  /** Null when the kernel completed no timed round at this size (it failed in warm-up). */
  candidate: KernelTiming | null;
  /** Null without an incumbent, or when it completed no timed round. */
  incumbent: KernelTiming | null;
  /**
   * HL estimate of candidate time / incumbent time across the blocks' estimates; null without an
   * incumbent or after a failure.
   */
  ratio: number | null;
  ci95: [number, number] | null;
  pValue: number | null;
  pValueAdjusted: number | null;
  /** Null without an incumbent or after a failure. */
  verdict: TimingVerdict | null;
  /** Each block's ratio estimate (exp of the HL estimate of its log-ratios); empty as for ratio. */
  blockRatios: number[];
  /** Robust sd of the blocks' log-ratio estimates (≈ relative spread); null as for ratio. */
  betweenBlockSpread: number | null;
  /** Robust sd of single rounds' log-ratios about their block's estimate; null as for ratio. */
  roundSpread: number | null;
  /** Time spent inside kernel calls at this size: warm-up and rounds, both kernels, all blocks. */
  callMs: number;
  flags: TimingFlag[];
  failure: TimingFailure | null;
}

export interface TimingProgress {
  /** 0-based block, of blockCount. */
  block: number;
  blockCount: number;
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
  /** A fresh kernel per block (FreshKernels, as a trial uses), or one kernel for every block. */
  candidate: KernelSupply<TInput>;
  incumbent?: KernelSupply<TInput> | null;
  /** A fresh copy of the same input for size n on every call. */
  makeInput: (n: number) => TInput;
  /** Blocks (default DEFAULT_BLOCKS); the verdict needs at least 6 (block-comparison.ts). */
  blocks?: number;
  /** Time for the timed rounds of each size, all blocks together, in ms (default DEFAULT_SIZE_BUDGET_MS). */
  budgetMs?: number;
  /**
   * Warm-up calls per kernel, size and block; default chosen from the first call (rounds.ts):
   * chooseWarmup in fresh kernels, chooseWarmupInWarmIsolate for the later sizes of a block.
   */
  warmup?: number;
  /** Bounds on the timed rounds per block and size (default MIN_BLOCK_ROUNDS, MAX_BLOCK_ROUNDS). */
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

/**
 * Stuck slow in at least half of the blocks (each block has its own isolates; one stuck isolate
 * sways one block estimate, which the rank-based comparison across blocks tolerates, while on a
 * busy machine single blocks trip the rule by chance), and a failure in any block.
 */
function flagsOf(
  blocks: readonly RawSizeTiming[],
  failure: TimingFailure | null,
  factor: number,
): TimingFlag[] {
  const flags: TimingFlag[] = [];
  for (const role of ['candidate', 'incumbent'] as const satisfies KernelRole[]) {
    const stuck = blocks.filter((raw) =>
      isStuckSlow(raw.warmMs[role].slice(1), raw.roundMs[role], factor),
    ).length;
    if (stuck > 0 && 2 * stuck >= blocks.length) flags.push(`${role}-stuck-slow`);
  }
  if (failure) flags.push(`${failure.kernel}-failed`);
  return flags;
}

function checkOptions<TInput>(options: InterleavedTimingOptions<TInput>): void {
  const { sizes, budgetMs = DEFAULT_SIZE_BUDGET_MS, warmup, blocks = DEFAULT_BLOCKS } = options;
  if (sizes.length === 0) throw new RangeError('sizes must not be empty');
  sizes.forEach((n, i) => {
    if (!Number.isInteger(n) || n < 1)
      throw new RangeError(`sizes[${i}] must be a positive integer, got ${n}`);
  });
  if (!(Number.isInteger(blocks) && blocks >= 1)) {
    throw new RangeError(`blocks must be a positive integer, got ${blocks}`);
  }
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

const isFresh = <TInput>(supply: KernelSupply<TInput>): supply is FreshKernels<TInput> =>
  'fresh' in supply;

type Opened<TInput> =
  | { ok: true; kernel: TimedKernel<TInput>; dispose: () => void }
  | { ok: false; failure: TimingFailure };

/** The block's kernel of one side: a fresh one, or the shared one (not disposed after the block). */
async function openKernel<TInput>(
  supply: KernelSupply<TInput>,
  role: KernelRole,
  block: number,
): Promise<Opened<TInput>> {
  if (!isFresh(supply)) return { ok: true, kernel: supply, dispose: () => {} };
  const fresh = await supply.fresh();
  if (!fresh.ok) {
    const { status, message } = fresh;
    return { ok: false, failure: { kernel: role, phase: 'warm-up', status, message, block } };
  }
  const kernel: DisposableTimedKernel<TInput> = fresh.kernel;
  return { ok: true, kernel, dispose: () => kernel.dispose() };
}

/**
 * Time candidate (and incumbent, if any) in B blocks. Each block opens a fresh kernel per side
 * (the candidate first in even blocks, the incumbent first in odd ones), then times every size
 * not yet failed, in the given order: warm-up (a full one for the block's first size, a short
 * one in the already warm isolates after it), then R interleaved rounds on fresh inputs
 * (interleaved-size.ts, the call order starting with the block's index), R from the budget
 * divided among the blocks; the kernels are disposed after the block. Per size: each side's
 * times summarised over all blocks, the comparison across blocks (block-comparison.ts, BH across
 * the sizes with an incumbent and no failure) and flags for a kernel stuck slow or failed.
 * Throws RangeError on bad options; a failed kernel call, or a fresh kernel that does not
 * start, is reported (that size, or every size, stops there), not thrown.
 */
export async function runInterleavedTiming<TInput>(
  options: InterleavedTimingOptions<TInput>,
): Promise<SizeTiming[]> {
  checkOptions(options);
  const { sizes, routine, rows = (n: number) => n, incumbent = null, onProgress } = options;
  const blockCount = options.blocks ?? DEFAULT_BLOCKS;
  const blockBudgetMs = (options.budgetMs ?? DEFAULT_SIZE_BUDGET_MS) / blockCount;
  const shared = !isFresh(options.candidate) && (incumbent === null || !isFresh(incumbent));
  const raws: RawSizeTiming[][] = sizes.map(() => []);
  const failures: (TimingFailure | null)[] = sizes.map(() => null);
  for (let block = 0; block < blockCount && failures.some((f) => f === null); block++) {
    const sides: [KernelRole, KernelSupply<TInput> | null][] = [
      ['candidate', options.candidate],
      ['incumbent', incumbent],
    ];
    if (block % 2 === 1) sides.reverse();
    const opened: Partial<Record<KernelRole, TimedKernel<TInput>>> = {};
    const disposers: (() => void)[] = [];
    try {
      let startFailure: TimingFailure | null = null;
      for (const [role, supply] of sides) {
        if (supply === null) continue;
        const side = await openKernel(supply, role, block);
        if (!side.ok) {
          startFailure = side.failure;
          break;
        }
        opened[role] = side.kernel;
        disposers.push(side.dispose);
      }
      if (startFailure !== null) {
        failures.forEach((f, i) => (failures[i] = f ?? startFailure));
        break;
      }
      // Isolates shared by every block are warm after the first block's first size.
      let warm = shared && block > 0;
      for (const [sizeIndex, n] of sizes.entries()) {
        if (failures[sizeIndex] !== null) continue;
        const report = (phase: TimingProgress['phase'], round: number, rounds: number) =>
          onProgress?.({
            block,
            blockCount,
            sizeIndex,
            sizeCount: sizes.length,
            n,
            phase,
            round,
            rounds,
          });
        report('warm-up', 0, 0);
        const raw = await timeOneSize({
          n,
          candidate: opened.candidate!,
          incumbent: opened.incumbent ?? null,
          makeInput: options.makeInput,
          budgetMs: blockBudgetMs,
          warmup:
            options.warmup !== undefined
              ? () => options.warmup!
              : warm
                ? chooseWarmupInWarmIsolate
                : chooseWarmup,
          orderOffset: block,
          minRounds: options.minRounds ?? MIN_BLOCK_ROUNDS,
          maxRounds: options.maxRounds ?? MAX_BLOCK_ROUNDS,
          onRound: (round, rounds) => report('timing', round, rounds),
        });
        raws[sizeIndex]!.push(raw);
        // A failed call may have replaced the isolate (kernel-instance.ts): not warm any more.
        warm = raw.failure === null;
        if (raw.failure !== null) failures[sizeIndex] = { ...raw.failure, block };
        report('done', raw.roundMs.candidate.length, raw.plannedRounds);
      }
    } finally {
      for (const dispose of disposers) dispose();
    }
  }
  const compared = sizes.map((_, i) => incumbent !== null && failures[i] === null);
  const comparisons = compareBlocks(
    raws
      .filter((_, i) => compared[i])
      .map((blocks) =>
        blocks.map((raw) => ({
          candidateMs: raw.roundMs.candidate,
          incumbentMs: raw.roundMs.incumbent,
        })),
      ),
    options,
  );
  let next = 0;
  return raws.map((blocks, i) => {
    const n = sizes[i]!;
    const m = rows(n);
    const c = compared[i] ? comparisons[next++]! : null;
    const all = (role: KernelRole) => blocks.flatMap((raw) => raw.roundMs[role]);
    const timed = blocks.filter((raw) => raw.roundMs.candidate.length > 0);
    const sum = (ms: number[]) => ms.reduce((a, b) => a + b, 0);
    const callMs = sum(
      blocks.flatMap((raw) =>
        (['candidate', 'incumbent'] as const).map(
          (role) => sum(raw.warmMs[role]) + sum(raw.roundMs[role]),
        ),
      ),
    );
    return {
      n,
      rounds: all('candidate').length,
      blocks: timed.length,
      roundsPerBlock: timed.map((raw) => raw.roundMs.candidate.length),
      candidate: kernelTiming(all('candidate'), routine, m, n),
      incumbent: kernelTiming(all('incumbent'), routine, m, n),
      ratio: c?.ratio ?? null,
      ci95: c?.ci95 ?? null,
      pValue: c?.pValue ?? null,
      pValueAdjusted: c?.pValueAdjusted ?? null,
      verdict: c?.verdict ?? null,
      blockRatios: c?.blockRatios ?? [],
      betweenBlockSpread: c?.betweenBlockSpread ?? null,
      roundSpread: c?.roundSpread ?? null,
      callMs,
      flags: flagsOf(blocks, failures[i] ?? null, options.stuckSlowFactor ?? STUCK_SLOW_FACTOR),
      failure: failures[i] ?? null,
    };
  });
}
