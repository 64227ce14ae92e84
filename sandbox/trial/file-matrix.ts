import type { Expectation, RoutineSlug } from '@shared/routines.ts';
import type { MatrixProperties, ReferenceMatrix } from '../matrices/reference-matrix.ts';
import type { ParsedMatrixMarket } from '../matrix-market/read.ts';
import { luFactorPartialPivoting } from '../reference/gepp.ts';

function isSymmetric(a: Float64Array, n: number): boolean {
  for (let i = 0; i < n; i++)
    for (let j = 0; j < i; j++) if (a[i * n + j] !== a[j * n + i]) return false;
  return true;
}

function isUpperTriangular(a: Float64Array, n: number): boolean {
  for (let i = 1; i < n; i++) for (let j = 0; j < i; j++) if (a[i * n + j] !== 0) return false;
  return true;
}

/**
 * Classifies a symmetric matrix by plain Cholesky in double: 'spd' when every pivot is
 * comfortably positive, 'indefinite' when one is clearly negative, 'unclear' when a pivot is
 * within rounding of zero, where only the arithmetic of the kernel would decide
 * (Higham, ASNA 2nd ed., §10.3, from memory: Cholesky succeeds in floating point when
 * roughly 20n^{3/2}·κ₂(A)·u < 1).
 */
function choleskyClass(a: Float64Array, n: number): 'spd' | 'indefinite' | 'unclear' {
  const l = Float64Array.from(a);
  let maxDiag = 0;
  for (let i = 0; i < n; i++) maxDiag = Math.max(maxDiag, Math.abs(a[i * n + i]!));
  const tiny = n * 2 ** -52 * maxDiag * 64;
  for (let j = 0; j < n; j++) {
    let d = l[j * n + j]!;
    for (let k = 0; k < j; k++) d -= l[j * n + k]! * l[j * n + k]!;
    if (!(d > tiny)) return d < -tiny ? 'indefinite' : 'unclear';
    const r = Math.sqrt(d);
    l[j * n + j] = r;
    for (let i = j + 1; i < n; i++) {
      let s = l[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
      l[i * n + j] = s / r;
    }
  }
  return 'spd';
}

/** A matrix uploaded as a Matrix Market file, with what the harness can tell about it. */
export function matrixFromFile(name: string, parsed: ParsedMatrixMarket): ReferenceMatrix {
  const { m, n, data } = parsed;
  const expectations: Partial<Record<RoutineSlug, Expectation>> = {};
  const square = m === n;
  const symmetric = square && isSymmetric(data, n);
  const upperTriangular = square && isUpperTriangular(data, n);
  let singular = false;
  let positiveDefinite = false;
  if (square) {
    singular = !luFactorPartialPivoting(data, n).ok;
    const verdict: Expectation = singular ? 'reject' : 'factor';
    expectations['lu-partial-pivoting'] = verdict;
    expectations['lu-no-pivoting'] = verdict;
    expectations['back-substitution'] = verdict;
    if (symmetric) {
      const cls = choleskyClass(data, n);
      positiveDefinite = cls === 'spd';
      if (cls === 'spd') {
        expectations.cholesky = 'factor';
        expectations.ldlt = 'factor';
      } else if (cls === 'indefinite') {
        expectations.cholesky = 'reject';
      }
    }
  }
  if (m >= n) expectations['householder-qr'] = 'factor';
  const properties: MatrixProperties = {
    symmetric,
    positiveDefinite,
    singular,
    upperTriangular,
    expectations,
    note: `uploaded file ${name} (${parsed.entries} stored entries, ${parsed.symmetry})`,
  };
  const base = name.split('/').pop() ?? name;
  return {
    id: `file-${base.replace(/\.mtx$/i, '')}`,
    family: 'file',
    m,
    n,
    seed: 0,
    params: {},
    data,
    properties,
    source: name,
  };
}
