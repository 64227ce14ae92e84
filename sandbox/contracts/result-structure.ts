import type { ReadRegion } from '@sandbox/contracts/routine-signatures.ts';

/**
 * Structural checks on a kernel's copied-out result, run on the host (validate-result.ts).
 * Dense row-major storage: entry (i, j) of a rows×cols array is a[i*cols + j].
 */

/** Does the region read by the checks contain entry (i, j)? */
function inRegion(region: ReadRegion, i: number, j: number): boolean {
  if (region === 'all') return true;
  if (region === 'lower') return j <= i;
  if (region === 'strict-lower') return j < i;
  return j >= i;
}

/**
 * Index of the first non-finite entry within the region the checks read, or −1. Cost: one pass
 * over rows·cols entries.
 */
export function firstNonFinite(
  a: ArrayLike<number>,
  rows: number,
  cols: number,
  region: ReadRegion,
): number {
  for (let i = 0; i < rows; i++) {
    const row = i * cols;
    for (let j = 0; j < cols; j++) {
      if (!Number.isFinite(a[row + j]!) && inRegion(region, i, j)) return row + j;
    }
  }
  return -1;
}

/**
 * Why `perm` is not a permutation of 0..n−1, or null when it is: the first entry out of range,
 * else the first value that repeats, with both positions.
 */
export function permutationProblem(perm: ArrayLike<number>, n: number): string | null {
  const seenAt = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const p = perm[i]!;
    if (p < 0 || p >= n) return `perm[${i}] = ${p} is out of range 0..${n - 1}`;
    const first = seenAt[p]!;
    if (first >= 0) return `perm repeats ${p} at positions ${first} and ${i}`;
    seenAt[p] = i;
  }
  return null;
}

/** Why the diagonal of the n×n factor `l` is not positive, or null when every entry is > 0. */
export function nonPositiveDiagonalProblem(l: ArrayLike<number>, n: number): string | null {
  for (let i = 0; i < n; i++) {
    const d = l[i * n + i]!;
    if (!(d > 0)) return `l[${i}, ${i}] = ${d} is not positive: the diagonal of L must be positive`;
  }
  return null;
}
