import type { RoutineSlug } from '@shared/routines.ts';
import { luGrowthFactor } from '../metrics/growth-factor.ts';
import { luFactorPartialPivoting } from '../reference/gepp.ts';

/** Growth max|U| / max|A| of Gaussian elimination without pivoting; Infinity at an exact zero pivot. */
function growthWithoutPivoting(a: ArrayLike<number>, n: number): number {
  const w = Float64Array.from(a);
  let maxA = 0;
  for (let k = 0; k < n * n; k++) maxA = Math.max(maxA, Math.abs(w[k]!));
  let maxU = 0;
  for (let k = 0; k < n; k++) {
    const pivot = w[k * n + k]!;
    for (let j = k; j < n; j++) maxU = Math.max(maxU, Math.abs(w[k * n + j]!));
    if (pivot === 0) return Infinity;
    for (let i = k + 1; i < n; i++) {
      const l = w[i * n + k]! / pivot;
      if (l === 0) continue;
      for (let j = k + 1; j < n; j++) w[i * n + j]! -= l * w[k * n + j]!;
    }
  }
  return maxA === 0 ? 1 : maxU / maxA;
}

/**
 * The growth factor of the algorithm a routine's contract prescribes, run by the harness on the
 * matrix itself: GEPP for LU with partial pivoting, elimination without pivoting for LU without
 * pivoting and for LDLᵀ (whose U is DLᵀ), and 1 where growth is bounded by theory (Cholesky;
 * Householder QR) or absent (back substitution). A sound kernel's backward error is bounded in
 * proportion to this growth: ‖ΔA‖ ≲ p(n)·ρ·u·‖A‖ (Higham, ASNA 2nd ed., Thm 9.5, from memory),
 * so the factor-ratio threshold is scaled by it.
 */
export function referenceGrowth(routine: RoutineSlug, a: ArrayLike<number>, n: number): number {
  switch (routine) {
    case 'lu-partial-pivoting': {
      const f = luFactorPartialPivoting(a, n);
      return f.ok ? luGrowthFactor(a, n, f.lu) : Infinity;
    }
    case 'lu-no-pivoting':
    case 'ldlt':
      return growthWithoutPivoting(a, n);
    default:
      return 1;
  }
}
