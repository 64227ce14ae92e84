import type { RoutineSlug } from '@shared/routines.ts';
import type { RoutineResult } from '@sandbox/contracts/routine-results.ts';
import {
  firstNonFinite,
  nonPositiveDiagonalProblem,
  permutationProblem,
} from '@sandbox/contracts/result-structure.ts';
import {
  notAnObjectMessage,
  promiseMessage,
  routineSignatures,
  wrongFieldMessage,
  type ResultField,
} from '@sandbox/contracts/routine-signatures.ts';

export type ValidationOutcome<R extends RoutineSlug> =
  | { ok: true; result: RoutineResult<R> }
  | { ok: false; status: 'invalid-output' | 'non-finite'; message: string };

type Invalid = { ok: false; status: 'invalid-output' | 'non-finite'; message: string };
const invalid = (message: string): Invalid => ({ ok: false, status: 'invalid-output', message });

/** A short description of a value for messages: `undefined`, `Array`, `Int32Array of length 4`. */
export function describeValue(v: unknown): string {
  if (v === null) return 'null';
  if (typeof v === 'function') return 'a function';
  if (typeof v !== 'object') return typeof v;
  if (ArrayBuffer.isView(v) && !(v instanceof DataView)) {
    const tag = Object.prototype.toString.call(v).slice(8, -1);
    return `${tag} of length ${(v as unknown as ArrayLike<number>).length}`;
  }
  return Array.isArray(v) ? 'Array' : 'object';
}

function isExactly(v: unknown, f: ResultField): v is Float64Array | Int32Array {
  const right = f.type === 'Float64Array' ? v instanceof Float64Array : v instanceof Int32Array;
  return right && (v as Float64Array | Int32Array).length === f.rows * f.cols;
}

function isThenable(v: unknown): boolean {
  return (
    typeof v === 'object' && v !== null && typeof (v as { then?: unknown }).then === 'function'
  );
}

function nonFiniteMessage(f: ResultField, index: number, value: number): string {
  const at = f.rows === 1 ? `[${index}]` : `[${Math.floor(index / f.cols)}, ${index % f.cols}]`;
  return (
    `${f.name}${at} = ${value}: a non-finite number where the checks read the result ` +
    `(a kernel that detects a failure must throw instead)`
  );
}

/**
 * Checks, on the host, a result copied out of the isolate against the routine's contract:
 * exact typed-array types and lengths, finiteness of every entry the checks read, then
 * structure (perm is a permutation of 0..n−1; Cholesky's diagonal is positive). Entries outside
 * the region a routine reads (above L's diagonal, below R's) are ignored, not rejected.
 * Returns a fresh result object holding only the contract's fields.
 * `value` is what the kernel returned: an object of fields, or the array itself for `solve`.
 */
export function validateResult<R extends RoutineSlug>(
  routine: R,
  value: unknown,
  dims: { m: number; n: number },
): ValidationOutcome<R> {
  const sig = routineSignatures[routine];
  const fields = sig.fields(dims.m, dims.n);
  const isTyped = ArrayBuffer.isView(value);
  if (!isTyped && isThenable(value)) return invalid(promiseMessage(sig.exportName));
  if (!sig.returnsArray && (typeof value !== 'object' || value === null || isTyped)) {
    return invalid(notAnObjectMessage(sig.exportName, fields, describeValue(value)));
  }
  const picked: Record<string, Float64Array | Int32Array> = {};
  for (const f of fields) {
    const v = sig.returnsArray ? value : (value as Record<string, unknown>)[f.name];
    if (!isExactly(v, f)) return invalid(wrongFieldMessage(f, describeValue(v)));
    picked[f.name] = v;
  }
  for (const f of fields) {
    const a = picked[f.name]!;
    const k = firstNonFinite(a, f.rows, f.cols, f.region);
    if (k >= 0) return { ok: false, status: 'non-finite', message: nonFiniteMessage(f, k, a[k]!) };
  }
  const problem =
    routine === 'lu-partial-pivoting'
      ? permutationProblem(picked.perm!, dims.n)
      : routine === 'cholesky'
        ? nonPositiveDiagonalProblem(picked.l!, dims.n)
        : null;
  if (problem !== null) return invalid(problem);
  return { ok: true, result: picked as unknown as RoutineResult<R> };
}
