/**
 * Norms of a symmetric n×n matrix of which only the lower triangle (j ≤ i) of the dense
 * row-major storage is read: entry (i, j) at s[i*n + j]. Same values as LAPACK's
 * DLANSY('1', 'L', …) and DLANSY('M', 'L', …) (SRC/dlansy.f), the norms of the symmetric test
 * ratios dpot01 and dsyt01 (TESTING/LIN).
 */

/**
 * ‖S‖₁ = ‖S‖∞ = max_j Σ_i |s_ij| of the symmetric matrix held in the lower triangle. Cost n²/2.
 * A NaN entry gives NaN (as norms.ts does), so that callers can report it as the worst score.
 */
export function symmetricNorm1Lower(s: ArrayLike<number>, n: number): number {
  const sums = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < i; j++) {
      const v = Math.abs(s[row + j]!);
      sums[i]! += v; // (i, j) in row i, and by symmetry (j, i) in column i
      sums[j]! += v;
    }
    sums[i]! += Math.abs(s[row + i]!);
  }
  let max = 0;
  for (let j = 0; j < n; j++) if (sums[j]! > max || Number.isNaN(sums[j]!)) max = sums[j]!;
  return max;
}

/** max_{j≤i} |s_ij| over the lower triangle. Cost n²/2. NaN entries give NaN. */
export function maxAbsLower(s: ArrayLike<number>, n: number): number {
  let max = 0;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j <= i; j++) {
      const v = Math.abs(s[row + j]!);
      if (v > max || Number.isNaN(v)) max = v;
    }
  }
  return max;
}
