/**
 * Growth factors seen from the final factors. Dense row-major n×n storage: entry (i, j) at
 * a[i*n + j]. The growth factor proper, ρ_n = max_{i,j,k} |a_ij^(k)| / max_ij |a_ij| over all
 * reduced matrices (Higham, ASNA 2nd ed., §9.3, from memory), needs the intermediate matrices;
 * the engine sees only the factors, so it reports the U-based ratio max|U| / max|A|, a lower
 * bound on ρ_n and the reciprocal of LAPACK's "reciprocal pivot growth" (SRC/dgesvx.f).
 * Conventions: 0/0 := 1 (a zero matrix with zero factors has grown by nothing; ρ_n ≥ 1 always,
 * since the k = 0 term is A itself), (nonzero)/0 := ∞, NaN := ∞. Cost n²/2 (LU), n² (LDLᵀ).
 */
import { maxAbs } from '@sandbox/numerics/norms.ts';
import { checkDimension, checkLength } from './argument-checks.ts';
import { powerOfTwoScale } from './power-of-two-scale.ts';
import { worstIfNaN } from './safe-ratio.ts';
import { maxAbsLower } from './symmetric-norm.ts';

/** max|u_ij| / max|a_ij| for the packed LU factors `lu` (U = upper triangle with diagonal). */
export function luGrowthFactor(a: ArrayLike<number>, n: number, lu: ArrayLike<number>): number {
  checkDimension('n', n);
  checkLength('a', a, n * n);
  checkLength('lu', lu, n * n);
  let maxU = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const v = Math.abs(lu[i * n + j]!);
      if (v > maxU || Number.isNaN(v)) maxU = v;
    }
  }
  return growthRatio(maxU, maxAbs(a));
}

/**
 * max|(DLᵀ)_kj| / max|a_ij| for A = LDLᵀ with unit lower L (strict lower part of `l`) and
 * D = diag(d); A symmetric, lower triangle read. Choice: LDLᵀ without 2×2 pivots is the LU
 * factorisation A = L·(DLᵀ), so U = DLᵀ (entries d_k·l_jk, diagonal d_k) holds exactly the
 * pivot rows of the reduced matrices, the same quantity as for LU (Higham, ASNA 2nd ed., §9.3
 * and ch. 11, from memory). max|D| alone would miss growth in off-diagonal entries d_k·l_jk.
 * The products are formed on σ·d with σ a power of two from max|A|, so they overflow only when
 * the growth itself exceeds the double range.
 */
export function ldltGrowthFactor(
  a: ArrayLike<number>,
  n: number,
  l: ArrayLike<number>,
  d: ArrayLike<number>,
): number {
  checkDimension('n', n);
  checkLength('a', a, n * n);
  checkLength('l', l, n * n);
  checkLength('d', d, n);
  const maxA = maxAbsLower(a, n);
  const sigma = powerOfTwoScale(maxA);
  let maxU = 0;
  for (let k = 0; k < n; k++) {
    const dk = sigma * d[k]!;
    let v = Math.abs(dk);
    if (v > maxU || Number.isNaN(v)) maxU = v;
    for (let j = k + 1; j < n; j++) {
      v = Math.abs(dk * l[j * n + k]!);
      if (v > maxU || Number.isNaN(v)) maxU = v;
    }
  }
  return growthRatio(maxU, sigma * maxA);
}

function growthRatio(maxU: number, maxA: number): number {
  if (Number.isNaN(maxU) || Number.isNaN(maxA)) return Infinity;
  if (maxA === 0) return maxU === 0 ? 1 : Infinity;
  return worstIfNaN(maxU / maxA);
}
