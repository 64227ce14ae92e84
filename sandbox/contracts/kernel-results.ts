/**
 * What each routine's kernel returns, after the host has copied it out of the isolate and
 * validated it (see product.md, "Routines and their contracts"). Dense row-major storage.
 */
export interface LuResult {
  /** n×n: strict lower part holds L (unit diagonal implied), upper part with diagonal holds U. */
  lu: Float64Array;
  /** Row i of PA is row perm[i] of A. Absent for LU without pivoting (identity). */
  perm?: Int32Array;
}
export interface CholeskyResult {
  /** n×n lower triangular L with A = LLᵀ (entries above the diagonal are ignored). */
  l: Float64Array;
}
export interface LdltResult {
  /** n×n: strict lower part holds unit lower L (entries on and above the diagonal ignored). */
  l: Float64Array;
  /** The n diagonal entries of D. */
  d: Float64Array;
}
export interface QrResult {
  /** m×n thin Q. */
  q: Float64Array;
  /** n×n upper triangular R (entries below the diagonal are ignored). */
  r: Float64Array;
}
export interface BackSubstitutionResult {
  x: Float64Array;
}
