import type { RoutineSlug } from '@shared/routines.ts';
import type { RoutineResult } from '@sandbox/contracts/routine-results.ts';
import type { CallArgs } from '@sandbox/isolate/transfer.ts';
import { randomMatrix, randomSpd, randomUpper } from '@tests/helpers/test-matrices.ts';
import {
  choleskyRatio,
  ldltRatio,
  luRatio,
  qrRatios,
  solveRatio,
} from '@tests/unit/sandbox/kernels/factor-checks.ts';

/**
 * A small seeded input each routine's kernel must factor: uniform for LU with pivoting,
 * diagonally dominant for LU without, SPD for Cholesky and LDLᵀ, tall uniform for QR, upper
 * triangular for back substitution.
 */
export function sampleArgs(routine: RoutineSlug, n: number, seed: number): CallArgs {
  if (routine === 'householder-qr') return { a: randomMatrix(n + 3, n, seed), m: n + 3, n };
  if (routine === 'cholesky' || routine === 'ldlt') return { a: randomSpd(n, seed), m: n, n };
  if (routine === 'back-substitution') {
    return { a: randomUpper(n, seed), m: n, n, b: randomMatrix(n, 1, seed + 1) };
  }
  const a = randomMatrix(n, n, seed);
  if (routine === 'lu-no-pivoting') for (let i = 0; i < n; i++) a[i * n + i] = a[i * n + i]! + n;
  return { a, m: n, n };
}

/** The LAPACK-style ratios of a routine's result on `args` (each below 30 for a sound kernel). */
export function residualRatios<R extends RoutineSlug>(
  routine: R,
  args: CallArgs,
  result: RoutineResult<R>,
): number[] {
  const { a, m, n } = args;
  const as = <S extends RoutineSlug>() => result as unknown as RoutineResult<S>;
  switch (routine) {
    case 'lu-partial-pivoting':
    case 'lu-no-pivoting': {
      const { lu, perm } = as<'lu-no-pivoting'>();
      return [luRatio(a, lu, perm, n)];
    }
    case 'cholesky':
      return [choleskyRatio(a, as<'cholesky'>().l, n)];
    case 'ldlt': {
      const { l, d } = as<'ldlt'>();
      return [ldltRatio(a, l, d, n)];
    }
    case 'householder-qr': {
      const { q, r } = as<'householder-qr'>();
      const { factor, orthogonality } = qrRatios(a, q, r, m, n);
      return [factor, orthogonality];
    }
    default:
      return [solveRatio(a, args.b!, as<'back-substitution'>().x, n)];
  }
}
