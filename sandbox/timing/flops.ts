import type { RoutineSlug } from '@shared/routines.ts';

/**
 * Leading-term floating-point operation counts of the built-in routines, the common convention for
 * reporting GFLOP/s (G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., 2013, §3.1, §3.2,
 * §4.1, §4.2, §5.2; section numbers from memory). Lower-order terms are left out on purpose, so
 * these are not LAPACK Working Note 41's exact counts.
 */

/**
 * Flops of one call of `routine` on an m×n problem (m rows; m = n for every routine but QR).
 * LU (either pivoting) 2n³/3; Cholesky and LDLᵀ n³/3; Householder QR, R and reflectors only,
 * 2mn² − 2n³/3 with m ≥ n; back substitution (one right-hand side) n².
 * Throws RangeError when m or n is not a non-negative integer, when m ≠ n for a square routine,
 * or when m < n for QR.
 */
export function flopCount(routine: RoutineSlug, m: number, n: number): number {
  if (!Number.isInteger(m) || m < 0)
    throw new RangeError(`m must be a non-negative integer, got ${m}`);
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (routine === 'householder-qr') {
    if (m < n) throw new RangeError(`m must be at least n for QR, got m = ${m}, n = ${n}`);
    return 2 * m * n * n - (2 * n * n * n) / 3; // GVL 4th ed. §5.2 (from memory)
  }
  if (m !== n) throw new RangeError(`m must equal n for ${routine}, got m = ${m}, n = ${n}`);
  switch (routine) {
    case 'lu-partial-pivoting':
    case 'lu-no-pivoting':
      return (2 * n * n * n) / 3; // GVL 4th ed. §3.2; pivoting adds only comparisons (from memory)
    case 'cholesky':
      return (n * n * n) / 3; // GVL 4th ed. §4.2 (from memory)
    case 'ldlt':
      return (n * n * n) / 3; // GVL 4th ed. §4.1 (from memory)
    case 'back-substitution':
      return n * n; // GVL 4th ed. §3.1 (from memory)
  }
}

/**
 * GFLOP/s of one call taking `ms` milliseconds: flopCount / (ms·10⁻³ s) / 10⁹ = flopCount/(ms·10⁶).
 * Throws RangeError when ms is not a positive finite number (and as flopCount does).
 */
export function gflops(routine: RoutineSlug, m: number, n: number, ms: number): number {
  if (!(ms > 0 && Number.isFinite(ms)))
    throw new RangeError(`ms must be positive and finite, got ${ms}`);
  return flopCount(routine, m, n) / (ms * 1e6);
}
