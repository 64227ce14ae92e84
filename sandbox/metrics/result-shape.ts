/**
 * Narrows a kernel result to the shape its routine's contract names
 * (sandbox/contracts/kernel-results.ts; product.md, "Routines and their contracts"). The host
 * validates results before metrics run, so a mismatch here is a programming error and throws a
 * TypeError naming `result`.
 */
import type {
  BackSubstitutionResult,
  CholeskyResult,
  LdltResult,
  LuResult,
  QrResult,
} from '@sandbox/contracts/kernel-results.ts';

/** Any routine's result. */
export type KernelResult =
  LuResult | CholeskyResult | LdltResult | QrResult | BackSubstitutionResult;

function field(result: KernelResult, key: string): Float64Array {
  const value = (result as unknown as Record<string, unknown>)[key];
  if (!(value instanceof Float64Array))
    throw new TypeError(`result.${key} must be a Float64Array for this routine`);
  return value;
}

/** { lu, perm? } of an LU routine; perm, when present, must be an Int32Array. */
export function asLuResult(result: KernelResult): LuResult {
  const lu = field(result, 'lu');
  const perm = (result as LuResult).perm;
  if (perm !== undefined && !(perm instanceof Int32Array))
    throw new TypeError('result.perm must be an Int32Array when present');
  return perm === undefined ? { lu } : { lu, perm };
}

/** { l } of Cholesky. */
export function asCholeskyResult(result: KernelResult): CholeskyResult {
  return { l: field(result, 'l') };
}

/** { l, d } of LDLᵀ. */
export function asLdltResult(result: KernelResult): LdltResult {
  return { l: field(result, 'l'), d: field(result, 'd') };
}

/** { q, r } of Householder QR. */
export function asQrResult(result: KernelResult): QrResult {
  return { q: field(result, 'q'), r: field(result, 'r') };
}

/** { x } of back substitution. */
export function asBackSubstitutionResult(result: KernelResult): BackSubstitutionResult {
  return { x: field(result, 'x') };
}
