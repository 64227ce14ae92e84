import type { RoutineSlug } from '@shared/routines.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import type { MatrixSpec, ReferenceMatrix } from '@sandbox/matrices/reference-matrix.ts';

/**
 * The matrix a routine is timed on at size n: well conditioned and of the kind the routine needs,
 * so that every kernel runs to completion and the time measures the ordinary path —
 * uniform for LU with pivoting and for Householder QR (square n×n), diagonally dominant for LU
 * without pivoting (safe without row exchanges), spd-random for Cholesky and LDLᵀ, and an upper
 * triangular diagonally dominant matrix for back substitution.
 */
export function timingMatrix(routine: RoutineSlug, n: number, seed: number): ReferenceMatrix {
  const specs: Record<RoutineSlug, MatrixSpec> = {
    'lu-partial-pivoting': { family: 'uniform', n, seed },
    'lu-no-pivoting': { family: 'diagonally-dominant', n, seed },
    cholesky: { family: 'spd-random', n, seed },
    ldlt: { family: 'spd-random', n, seed },
    'householder-qr': { family: 'uniform', n, seed },
    'back-substitution': { family: 'diagonally-dominant', n, seed, params: { upper: 1 } },
  };
  const spec = specs[routine];
  if (!spec) throw new RangeError(`routine must be a routine slug, got ${String(routine)}`);
  return generateMatrix(spec);
}
