import type { Expectation, RoutineSlug } from '@shared/routines.ts';
import type { ReferenceMatrix } from '../matrices/reference-matrix.ts';
import { createRandom } from '../matrices/random.ts';
import { powerOfTwoScale } from '../metrics/power-of-two-scale.ts';
import { matVecAccurate } from '../numerics/accurate-residual.ts';
import { maxAbs } from '../numerics/norms.ts';
import { conditionEstimate1 } from '../reference/condition-estimate.ts';
import { referenceSolve } from '../reference/reference-solve.ts';
import { upperFactorForBackSubstitution } from './back-substitution-input.ts';
import { referenceGrowth } from './reference-growth.ts';

/** One matrix made ready for one routine: what the kernel receives and what it is judged against. */
export interface PreparedCase {
  matrix: ReferenceMatrix;
  expected: Expectation;
  /** The matrix the kernel receives (for back substitution, the upper triangular U). */
  a: Float64Array;
  m: number;
  n: number;
  /** Right-hand side b = A·x_true, computed accurately then rounded; absent for QR. */
  b?: Float64Array;
  /** The reference solution of A x = b; absent for QR and for matrices that must be rejected. */
  xRef?: Float64Array;
  referenceTrusted: boolean;
  /** κ₁ of the matrix the kernel receives, exact where known. */
  condition: number | null;
  conditionKind: 'exact' | 'estimate' | null;
  /** κ∞, for forward error over its bound κ∞·u. */
  conditionInf: number | null;
  /** Growth of the contract's own algorithm on this matrix (reference-growth.ts); null for QR. */
  referenceGrowth: number | null;
}

function transpose(a: Float64Array, n: number): Float64Array {
  const t = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) t[j * n + i] = a[i * n + j]!;
  return t;
}

/**
 * Prepares a matrix for a routine, or returns null when the routine does not apply to it.
 * Right-hand side: x_true has seeded entries in [-1, 1) and b = A·x_true is computed with
 * Dot2 accuracy, then rounded (numerics.md, "Right-hand sides").
 */
export function prepareCase(
  matrix: ReferenceMatrix,
  routine: RoutineSlug,
  seed: number,
): PreparedCase | null {
  const expected = matrix.properties.expectations[routine];
  if (!expected) return null;
  const { m, n } = matrix;
  if (routine === 'householder-qr') {
    return {
      matrix,
      expected,
      a: matrix.data,
      m,
      n,
      referenceTrusted: false,
      condition: m === n ? conditionOf(matrix, matrix.data) : null,
      conditionKind: m === n ? kindOf(matrix) : null,
      conditionInf: null,
      referenceGrowth: null,
    };
  }
  const a =
    routine === 'back-substitution'
      ? upperFactorForBackSubstitution(matrix.data, n, matrix.properties.upperTriangular)
      : matrix.data;
  const random = createRandom(seed);
  const xTrue = new Float64Array(n);
  for (let i = 0; i < n; i++) xTrue[i] = 2 * random.uniform() - 1;
  // Scale by a power of two (exact) so that the accurate products neither overflow nor
  // underflow on matrices near the ends of the range; A x = b has the same solution scaled.
  const sigma = powerOfTwoScale(maxAbs(a));
  const aScaled = sigma === 1 ? a : a.map((v) => v * sigma);
  const bScaled = matVecAccurate(aScaled, n, n, xTrue);
  const b = sigma === 1 ? bScaled : bScaled.map((v) => v / sigma);
  const useExact = routine !== 'back-substitution' || matrix.properties.upperTriangular;
  const condition = useExact ? conditionOf(matrix, a) : conditionEstimate1(a, n);
  const conditionKind = useExact ? kindOf(matrix) : 'estimate';
  const symmetric = matrix.properties.symmetric && routine !== 'back-substitution';
  const conditionInf = symmetric ? condition : conditionEstimate1(transpose(a, n), n);
  const growth = referenceGrowth(routine, a, n);
  if (expected === 'reject') {
    return {
      matrix,
      expected,
      a,
      m,
      n,
      b,
      referenceTrusted: false,
      condition,
      conditionKind,
      conditionInf,
      referenceGrowth: growth,
    };
  }
  const reference = referenceSolve(aScaled, n, bScaled);
  return {
    matrix,
    expected,
    a,
    m,
    n,
    b,
    xRef: reference.x,
    referenceTrusted: reference.trusted,
    condition,
    conditionKind,
    conditionInf,
    referenceGrowth: growth,
  };
}

function conditionOf(matrix: ReferenceMatrix, a: Float64Array): number {
  return matrix.properties.exactCondition1 ?? conditionEstimate1(a, matrix.n);
}

function kindOf(matrix: ReferenceMatrix): 'exact' | 'estimate' {
  return matrix.properties.exactCondition1 === undefined ? 'estimate' : 'exact';
}
