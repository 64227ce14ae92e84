/**
 * x̂ from a kernel's factors, solved with the harness's trusted triangular solves
 * (sandbox/numerics/triangular-solve.ts), so that the solve metrics measure the factors and not
 * a kernel's own solve (product.md). Dense row-major n×n storage: entry (i, j) at t[i*n + j];
 * layouts of the factors as in sandbox/contracts/kernel-results.ts. Cost 2n² flops (LU,
 * Cholesky), 2n² + n (LDLᵀ). Non-finite factors give non-finite entries, never an exception.
 */
import {
  solveLower,
  solveLowerTransposed,
  solveLowerUnit,
  solveLowerUnitTransposed,
  solveUpper,
} from '@sandbox/numerics/triangular-solve.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import { checkDimension, checkLength, checkPermutation } from './argument-checks.ts';
import {
  asBackSubstitutionResult,
  asCholeskyResult,
  asLdltResult,
  asLuResult,
  type KernelResult,
} from './result-shape.ts';

/**
 * x̂ for a routine's result and right-hand side b: the factor solves below for LU, Cholesky and
 * LDLᵀ (LU without pivoting ignores any perm: its contract is A = LU), a copy of the kernel's
 * own x for back substitution, and undefined for QR (no solve metrics, numerics.md).
 */
export function solveWithFactors(
  routine: RoutineSlug,
  result: KernelResult,
  b: ArrayLike<number>,
  n: number,
): Float64Array | undefined {
  switch (routine) {
    case 'lu-partial-pivoting': {
      const { lu, perm } = asLuResult(result);
      return solveWithLu(lu, perm, b, n);
    }
    case 'lu-no-pivoting':
      return solveWithLu(asLuResult(result).lu, undefined, b, n);
    case 'cholesky':
      return solveWithCholesky(asCholeskyResult(result).l, b, n);
    case 'ldlt': {
      const { l, d } = asLdltResult(result);
      return solveWithLdlt(l, d, b, n);
    }
    case 'householder-qr':
      return undefined;
    case 'back-substitution': {
      const { x } = asBackSubstitutionResult(result);
      checkLength('result.x', x, n);
      return Float64Array.from(x);
    }
  }
}

/**
 * Solves Ax = b from PA = LU: Ly = Pb (unit lower, forward substitution), then Ux = y (back
 * substitution) (Golub & Van Loan, 4th ed., §3.2, from memory). Row i of PA is row perm[i] of A,
 * so (Pb)_i = b[perm[i]]; no perm = identity.
 */
export function solveWithLu(
  lu: ArrayLike<number>,
  perm: ArrayLike<number> | undefined,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkDimension('n', n);
  checkLength('lu', lu, n * n);
  checkLength('b', b, n);
  const pb = new Float64Array(n);
  if (perm === undefined) pb.set(b);
  else {
    checkPermutation(perm, n);
    for (let i = 0; i < n; i++) pb[i] = b[perm[i]!]!;
  }
  return solveUpper(lu, solveLowerUnit(lu, pb, n), n);
}

/** Solves Ax = b from A = LLᵀ: Ly = b, then Lᵀx = y (Golub & Van Loan, 4th ed., §4.2, from memory). */
export function solveWithCholesky(
  l: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkDimension('n', n);
  checkLength('l', l, n * n);
  return solveLowerTransposed(l, solveLower(l, b, n), n);
}

/**
 * Solves Ax = b from A = LDLᵀ, L unit lower: Ly = b, z = D⁻¹y, Lᵀx = z (Golub & Van Loan, 4th
 * ed., §4.1, from memory).
 */
export function solveWithLdlt(
  l: ArrayLike<number>,
  d: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkDimension('n', n);
  checkLength('l', l, n * n);
  checkLength('d', d, n);
  const z = solveLowerUnit(l, b, n);
  for (let i = 0; i < n; i++) z[i] = z[i]! / d[i]!;
  return solveLowerUnitTransposed(l, z, n);
}
