/**
 * How many blocks, timed rounds and warm-up calls to spend on one size. Rounds are cheap at small
 * n, so a fixed time budget buys many there and few at large n (numerics.md, "Timing"). The
 * generic bounds of chooseRounds are common practice: at least 11 rounds, so that the exact 95 %
 * signed-rank interval over the rounds exists (it needs at least 6) with some room to spare; at
 * most 201, beyond which the interval narrows only slowly (like 1/√R) while drift of a busy
 * machine grows with the time spent.
 */

export const MIN_ROUNDS = 11;
export const MAX_ROUNDS = 201;
export const MIN_WARMUP = 5;
export const MAX_WARMUP = 30;

/** Warm-up should cover at least this much run time, as well as MIN_WARMUP calls (common practice). */
export const WARMUP_TIME_MS = 100;

/**
 * Blocks of a timing run, each with a fresh isolate per kernel (block-comparison.ts). The verdict
 * bounds the ratio across the blocks' estimates with the exact signed-rank interval: 12 blocks give
 * the 95 % interval [W_(14), W_(65)] of the 78 Walsh averages and a two-sided p-value of
 * 4/2¹² ≈ 0.001 even when the block nearest zero falls on the wrong side, below 0.05/6, so a
 * single clear size survives Benjamini–Hochberg over up to six sizes despite one stray block
 * (8 blocks, the fewest whose smallest p-value 2/2⁸ lies below 0.05/6, could not: one stray block
 * gave 4/2⁸ ≈ 0.016). Measured (benchmarks/README.md, timing-calibration): 8 blocks missed a
 * planted +10 % in about a third of the trials on a quiet machine; 12 cost about 1.4× the timing
 * time of 8. Each block costs a fresh isolate pair, its warm-up, and at least one round per size.
 */
export const DEFAULT_BLOCKS = 12;

/**
 * Rounds per block and size: at least 1 (a block's estimate is then its one log-ratio; the call
 * order still alternates from block to block) and at most 100. Single rounds are noisy at small
 * n (measured on a quiet machine at n = 64, calls of about 0.13 ms: a robust sd of 0.16 in the
 * log-ratio of one round), so a block needs many of them before its estimate is as steady as the
 * isolate's own effect of 1–2 %: 100 rounds bring it to about 0.02 for 100 × 2 × 0.13 ms = 26 ms.
 * At large n the time budget, not this bound, decides.
 */
export const MIN_BLOCK_ROUNDS = 1;
export const MAX_BLOCK_ROUNDS = 100;

/**
 * A later size in a block runs in isolates that are already warm (the same compiled code, other
 * array lengths), so it needs only enough calls to settle its own caches and to measure a round:
 * about this much run time, 1 to MIN_WARMUP calls (measured: at n = 128…512 the first call in a
 * warm isolate was within the spread of the later ones; common practice otherwise).
 */
export const WARM_ISOLATE_WARMUP_TIME_MS = 20;

export interface RoundsOptions {
  /** Time to spend on the timed rounds of this size, in ms. */
  budgetMs: number;
  /** Measured cost of one round (all kernels' calls in it), in ms, e.g. from the last warm-up calls. */
  roundMs: number;
  minRounds?: number;
  maxRounds?: number;
}

function clamp(value: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, value));
}

/**
 * R = clamp(⌊budgetMs/roundMs⌋, minRounds, maxRounds): as many rounds as fit in the budget, within
 * the bounds (the minimum wins over the budget; roundMs = 0, a call below the timer's resolution,
 * gives maxRounds). Cost O(1). Throws RangeError when budgetMs or roundMs is negative or not
 * finite, or the bounds are not integers with
 * 1 ≤ minRounds ≤ maxRounds.
 */
export function chooseRounds(options: RoundsOptions): number {
  const { budgetMs, roundMs, minRounds = MIN_ROUNDS, maxRounds = MAX_ROUNDS } = options;
  if (!(budgetMs >= 0 && Number.isFinite(budgetMs))) {
    throw new RangeError(`budgetMs must be ≥ 0 and finite, got ${budgetMs}`);
  }
  if (!(roundMs >= 0 && Number.isFinite(roundMs))) {
    throw new RangeError(`roundMs must be ≥ 0 and finite, got ${roundMs}`);
  }
  if (!Number.isInteger(minRounds) || minRounds < 1) {
    throw new RangeError(`minRounds must be a positive integer, got ${minRounds}`);
  }
  if (!Number.isInteger(maxRounds) || maxRounds < minRounds) {
    throw new RangeError(`maxRounds must be an integer ≥ minRounds, got ${maxRounds}`);
  }
  if (roundMs === 0) return maxRounds;
  return clamp(Math.floor(budgetMs / roundMs), minRounds, maxRounds);
}

/**
 * Warm-up calls per kernel for one size, from the time of its first call:
 * clamp(⌈WARMUP_TIME_MS/firstCallMs⌉, MIN_WARMUP, MAX_WARMUP). The first call includes compilation
 * and so overstates the warm time (stack.md: 29 ms against 0.85 ms for LU at n = 128), which only
 * errs towards fewer warm-up calls at large n, where each call runs long loops that V8 optimises on
 * stack (common practice). Throws RangeError when firstCallMs is negative or not finite.
 */
export function chooseWarmup(firstCallMs: number): number {
  if (!(firstCallMs >= 0 && Number.isFinite(firstCallMs))) {
    throw new RangeError(`firstCallMs must be ≥ 0 and finite, got ${firstCallMs}`);
  }
  return clamp(Math.ceil(WARMUP_TIME_MS / firstCallMs), MIN_WARMUP, MAX_WARMUP);
}

/**
 * Warm-up calls per kernel for a size in isolates that already ran another size:
 * clamp(⌈WARM_ISOLATE_WARMUP_TIME_MS/firstCallMs⌉, 1, MIN_WARMUP). Throws RangeError when
 * firstCallMs is negative or not finite.
 */
export function chooseWarmupInWarmIsolate(firstCallMs: number): number {
  if (!(firstCallMs >= 0 && Number.isFinite(firstCallMs))) {
    throw new RangeError(`firstCallMs must be ≥ 0 and finite, got ${firstCallMs}`);
  }
  return clamp(Math.ceil(WARM_ISOLATE_WARMUP_TIME_MS / firstCallMs), 1, MIN_WARMUP);
}
