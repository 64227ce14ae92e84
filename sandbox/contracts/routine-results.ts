import type { RoutineSlug } from '@shared/routines.ts';
import type {
  BackSubstitutionResult,
  CholeskyResult,
  LdltResult,
  LuResult,
  QrResult,
} from '@sandbox/contracts/kernel-results.ts';

/** The validated, host-side result of one kernel call, per routine. */
export interface RoutineResultMap {
  /** Partial pivoting always carries its permutation. */
  'lu-partial-pivoting': Required<LuResult>;
  /** No pivoting: `perm` is absent (the identity). */
  'lu-no-pivoting': LuResult;
  cholesky: CholeskyResult;
  ldlt: LdltResult;
  'householder-qr': QrResult;
  'back-substitution': BackSubstitutionResult;
}

export type RoutineResult<R extends RoutineSlug> = RoutineResultMap[R];
