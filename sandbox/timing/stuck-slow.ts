import { median } from '@sandbox/stats/quantiles.ts';

/**
 * Detection of a kernel "stuck slow": V8 sometimes never finishes optimising code inside an
 * isolate, which then runs 1.4–2× (once about 30×) slower for the rest of the process
 * (stack.md, isolated-vm tiering hazard; measured). A kernel that was fast once during a size and
 * then stays far above that level is flagged, so a slowdown it causes is not taken at face value.
 * Limitation: a kernel that is slow from its very first call has no fast level of its own to
 * compare with and is not detected here; running Node with --no-concurrent-recompilation is the
 * remedy for that case.
 */

/** Flag when the late times exceed this multiple of the warm level (below the 1.4× lower end). */
export const STUCK_SLOW_FACTOR = 1.3;

/** Fewest timed rounds for a judgement; with fewer the flag is never raised. */
export const STUCK_SLOW_MIN_ROUNDS = 4;

/**
 * True when the median of the second half of `roundMs` exceeds factor × the warm level, the warm
 * level being the minimum over `warmMs` (warm-up calls after the first, which carries compilation)
 * and `roundMs`. The minimum is the robust location under positive timing noise (Chen & Revels,
 * arXiv:1608.04295, 2016); the late median asks that the slowness persist, not just spike.
 * Cost O(R log R). Throws RangeError when factor is not greater than 1.
 */
export function isStuckSlow(
  warmMs: readonly number[],
  roundMs: readonly number[],
  factor = STUCK_SLOW_FACTOR,
): boolean {
  if (!(factor > 1 && Number.isFinite(factor)))
    throw new RangeError(`factor must exceed 1, got ${factor}`);
  if (roundMs.length < STUCK_SLOW_MIN_ROUNDS) return false;
  const warmLevel = Math.min(...warmMs, ...roundMs);
  const late = median(roundMs.slice(Math.floor(roundMs.length / 2)));
  return late > factor * warmLevel;
}
