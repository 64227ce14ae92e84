import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';

/**
 * How far the smallest pivot of an elimination sits above rounding noise: a pivot margin of 1000
 * or more means no kernel that is backward stable can turn that pivot into an exact zero by a
 * different rounding order (common practice: the perturbation of a computed pivot is bounded by
 * γ_n·(|L||U|)_kk ≤ n·u·max|u_ij| for |l_ij| ≤ 1; Higham, ASNA 2nd ed., Thm 9.3, from memory).
 */
export const SAFE_PIVOT_MARGIN = 1000;

/** Largest order for which the generators run pivotMargins (about 0.2 s at n = 512). */
export const PIVOT_MARGIN_ORDER_LIMIT = 512;

export interface PivotMargins {
  /** min_k |u_kk| / (n·u·max_ij |u_ij|) for GEPP, first maximum on ties (0 on an exact zero). */
  partialPivoting: number;
  /** The same for elimination without pivoting (0 after an exact zero pivot). */
  noPivoting: number;
  /** Every pivot of the elimination without pivoting is positive. */
  noPivotingPositive: boolean;
}

function eliminate(
  a0: ArrayLike<number>,
  n: number,
  pivoting: boolean,
): { margin: number; positive: boolean } {
  const a = Float64Array.from(a0);
  let maxU = 0;
  let minPivot = Infinity;
  let positive = true;
  for (let k = 0; k < n; k++) {
    let p = k;
    if (pivoting) {
      let best = Math.abs(a[k * n + k]!);
      for (let i = k + 1; i < n; i++) {
        const v = Math.abs(a[i * n + k]!);
        if (v > best) {
          best = v;
          p = i;
        }
      }
    }
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
    }
    const pivot = a[k * n + k]!;
    for (let j = k; j < n; j++) maxU = Math.max(maxU, Math.abs(a[k * n + j]!));
    minPivot = Math.min(minPivot, Math.abs(pivot));
    if (!(pivot > 0)) positive = false;
    if (pivot === 0 || !Number.isFinite(pivot)) return { margin: 0, positive: false };
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      if (l === 0) continue;
      for (let j = k + 1; j < n; j++) a[i * n + j]! -= l * a[k * n + j]!;
    }
  }
  const margin = minPivot / (n * UNIT_ROUNDOFF * maxU);
  return { margin: Number.isFinite(margin) ? margin : 0, positive };
}

/**
 * Pivot margins of the stored n×n matrix a (row-major, entry (i, j) at a[i*n + j]) under
 * right-looking Gaussian elimination with and without partial pivoting (Golub & Van Loan, 4th
 * ed., Alg. 3.4.1 and 3.2.1). Cost 4n³/3 flops. The input is not modified.
 */
export function pivotMargins(a: ArrayLike<number>, n: number): PivotMargins {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`n must be a positive integer, got ${n}`);
  if (a.length !== n * n)
    throw new RangeError(`a must hold n*n = ${n * n} entries, has ${a.length}`);
  const partial = eliminate(a, n, true);
  const none = eliminate(a, n, false);
  return {
    partialPivoting: partial.margin,
    noPivoting: none.margin,
    noPivotingPositive: none.positive,
  };
}
