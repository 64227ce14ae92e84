import type { Expectation, RoutineSlug } from '@shared/routines.ts';

// The family slugs live in shared/ so that the client can offer them too.
import { familySlugs, type FamilySlug } from '@shared/matrix-families.ts';
export { familySlugs, type FamilySlug };

/** A recipe for one generated matrix: the same recipe gives the same bits on every machine. */
export interface MatrixSpec {
  family: FamilySlug;
  /** Columns (and rows, unless m is given). */
  n: number;
  /** Rows, for rectangular families (tall-random); defaults to n. */
  m?: number;
  seed?: number;
  params?: Record<string, number>;
}

/** What is known about a matrix before any kernel sees it. */
export interface MatrixProperties {
  symmetric: boolean;
  /** Symmetric positive definite (known from the construction). */
  positiveDefinite: boolean;
  /** Exactly singular in exact arithmetic. */
  singular: boolean;
  /** κ₁(A) = ‖A‖₁‖A⁻¹‖₁ when known exactly (closed form or exact arithmetic); else undefined. */
  exactCondition1?: number;
  /** Upper triangular (the back-substitution routine can take it as it is). */
  upperTriangular: boolean;
  /**
   * Per routine: must the kernel factor this matrix or reject it by throwing? A routine without
   * an entry does not apply (for example Cholesky on a non-symmetric matrix).
   */
  expectations: Partial<Record<RoutineSlug, Expectation>>;
  /** One line for a reviewer: why this matrix is in the set. */
  note: string;
}

/** A dense row-major m×n matrix with its provenance: entry (i, j) is data[i*n + j]. */
export interface ReferenceMatrix {
  /** Stable id within a set, e.g. `hilbert-n8` or `uniform-n64-s3`. */
  id: string;
  family: FamilySlug | 'file';
  m: number;
  n: number;
  seed: number;
  params: Record<string, number>;
  data: Float64Array;
  properties: MatrixProperties;
  /** For uploaded files: the file's name. */
  source?: string;
}
