import type { RoutineSlug } from '@shared/routines.ts';
import { backSubstitutionContract } from '@shared/contracts/back-substitution.ts';
import { choleskyContract } from '@shared/contracts/cholesky.ts';
import { householderQrContract } from '@shared/contracts/householder-qr.ts';
import { ldltContract } from '@shared/contracts/ldlt.ts';
import { luNoPivotingContract } from '@shared/contracts/lu-no-pivoting.ts';
import { luPartialPivotingContract } from '@shared/contracts/lu-partial-pivoting.ts';

/**
 * Each routine's contract as TypeScript declaration text: the `contract.d.ts` a kernel is
 * type-checked against, and the typings the editor shows (product.md, "Routines and their
 * contracts").
 */
export const contractTexts: Record<RoutineSlug, string> = {
  'lu-partial-pivoting': luPartialPivotingContract,
  'lu-no-pivoting': luNoPivotingContract,
  cholesky: choleskyContract,
  ldlt: ldltContract,
  'householder-qr': householderQrContract,
  'back-substitution': backSubstitutionContract,
};

/** The function a kernel for each routine must export. */
export const contractExports: Record<RoutineSlug, 'factor' | 'solve'> = {
  'lu-partial-pivoting': 'factor',
  'lu-no-pivoting': 'factor',
  cholesky: 'factor',
  ldlt: 'factor',
  'householder-qr': 'factor',
  'back-substitution': 'solve',
};
