import type { RoutineSlug } from '@shared/routines.ts';
import { contractExports } from '@shared/contracts/contract-texts.ts';

export type TypedArrayName = 'Float64Array' | 'Int32Array';

/** Which parts of an m×n result the checks read; only those must be finite. */
export type ReadRegion = 'all' | 'lower' | 'strict-lower' | 'upper';

/** One typed array a kernel returns, with the size the contract demands for given m, n. */
export interface ResultField {
  /** Property name in the returned object (`x` for a kernel that returns the array itself). */
  name: string;
  /** How messages name it: `lu`, or `the result of solve`. */
  subject: string;
  type: TypedArrayName;
  rows: number;
  cols: number;
  /** The length as messages state it, e.g. `n·n = 25`. */
  lengthText: string;
  region: ReadRegion;
}

/** How a routine's kernel is called and what it must return (product.md, contracts table). */
export interface RoutineSignature {
  exportName: 'factor' | 'solve';
  /** The kernel's parameters in order: `a, n`, `a, m, n` (QR) or `u, b, n` (back substitution). */
  parameters: 'a, n' | 'a, m, n' | 'u, b, n';
  /** The kernel returns its single typed array itself, not an object of fields. */
  returnsArray: boolean;
  /** The result fields for an m×n input (m = n except for QR). */
  fields(m: number, n: number): ResultField[];
}

function field(
  name: string,
  type: TypedArrayName,
  rows: number,
  cols: number,
  lengthText: string,
  region: ReadRegion,
): ResultField {
  return { name, subject: name, type, rows, cols, lengthText, region };
}

const square = (n: number) => `n·n = ${n * n}`;

export const routineSignatures: Record<RoutineSlug, RoutineSignature> = {
  'lu-partial-pivoting': {
    exportName: contractExports['lu-partial-pivoting'],
    parameters: 'a, n',
    returnsArray: false,
    fields: (_m, n) => [
      field('lu', 'Float64Array', n, n, square(n), 'all'),
      field('perm', 'Int32Array', 1, n, `n = ${n}`, 'all'),
    ],
  },
  'lu-no-pivoting': {
    exportName: contractExports['lu-no-pivoting'],
    parameters: 'a, n',
    returnsArray: false,
    fields: (_m, n) => [field('lu', 'Float64Array', n, n, square(n), 'all')],
  },
  cholesky: {
    exportName: contractExports.cholesky,
    parameters: 'a, n',
    returnsArray: false,
    fields: (_m, n) => [field('l', 'Float64Array', n, n, square(n), 'lower')],
  },
  ldlt: {
    exportName: contractExports.ldlt,
    parameters: 'a, n',
    returnsArray: false,
    fields: (_m, n) => [
      field('l', 'Float64Array', n, n, square(n), 'strict-lower'),
      field('d', 'Float64Array', 1, n, `n = ${n}`, 'all'),
    ],
  },
  'householder-qr': {
    exportName: contractExports['householder-qr'],
    parameters: 'a, m, n',
    returnsArray: false,
    fields: (m, n) => [
      field('q', 'Float64Array', m, n, `m·n = ${m * n}`, 'all'),
      field('r', 'Float64Array', n, n, square(n), 'upper'),
    ],
  },
  'back-substitution': {
    exportName: contractExports['back-substitution'],
    parameters: 'u, b, n',
    returnsArray: true,
    fields: (_m, n) => [
      { ...field('x', 'Float64Array', 1, n, `n = ${n}`, 'all'), subject: 'the result of solve' },
    ],
  },
};

/**
 * The message for a result field of the wrong type or length. The isolate gets the same text
 * with `got` empty and appends its own description, so the wording lives here only.
 */
export function wrongFieldMessage(f: ResultField, got: string): string {
  const article = f.type === 'Int32Array' ? 'an' : 'a';
  return `${f.subject} must be ${article} ${f.type} of length ${f.lengthText}, got ${got}`;
}

/** The message for a result that is not an object of fields (prefix passed to the isolate as above). */
export function notAnObjectMessage(exportName: string, fields: ResultField[], got: string): string {
  return `${exportName} must return an object with ${fields.map((f) => f.name).join(' and ')}, got ${got}`;
}

/** The message for a Promise returned by an async kernel (passed to the isolate as it is). */
export function promiseMessage(exportName: string): string {
  return `${exportName} returned a Promise: kernels must be synchronous (async functions are not supported)`;
}
