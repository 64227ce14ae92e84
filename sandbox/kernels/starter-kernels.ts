import type { RoutineSlug } from '@shared/routines.ts';

/**
 * The starter kernel offered for each routine, relative to `sandbox/kernels/`: a plain, correct
 * implementation an author can begin from (read it with read-kernel-source.ts).
 */
export const starterKernelFiles: Record<RoutineSlug, string> = {
  'lu-partial-pivoting': 'starters/lu-partial-pivoting.ts',
  'lu-no-pivoting': 'starters/lu-no-pivoting.ts',
  cholesky: 'starters/cholesky.ts',
  ldlt: 'starters/ldlt.ts',
  'householder-qr': 'starters/householder-qr.ts',
  'back-substitution': 'starters/back-substitution.ts',
};
