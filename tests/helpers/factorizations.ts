/**
 * Small, plainly written factorisations and solves in double for the tests (not the engine's
 * reference solver, so that the engine is checked against code written apart from it):
 * right-looking Gaussian elimination with and without partial pivoting (Golub & Van Loan, 4th
 * ed., Alg. 3.4.1 and 3.2.1), a dot-product (Crout-like) variant, Cholesky (GVL Alg. 4.2.1),
 * LDLᵀ without pivoting (GVL Alg. 4.1.2) and substitution (GVL §3.1), all from memory.
 * Row-major n×n, entry (i, j) at a[i*n + j]; inputs are never mutated. A factorisation that
 * meets a zero pivot stops there and says at which step, the factors so far returned as they are.
 */

export interface LuOutcome {
  /** L (strict lower, unit diagonal implied) and U packed. */
  lu: Float64Array;
  /** Row i of PA is row perm[i] of A. */
  perm: Int32Array;
  /** Step (0-based) at which an exactly zero pivot was met; undefined when none. */
  zeroPivotAt?: number;
}

/** Exchanges rows k and p of the packed n×n a and entries k and p of perm. */
function swapRows(a: Float64Array, perm: Int32Array, n: number, k: number, p: number): void {
  for (let j = 0; j < n; j++) {
    const t = a[k * n + j]!;
    a[k * n + j] = a[p * n + j]!;
    a[p * n + j] = t;
  }
  const t = perm[k]!;
  perm[k] = perm[p]!;
  perm[p] = t;
}

/** Step k of right-looking elimination: multipliers below a_kk, rank-one update of the rest. */
function eliminate(a: Float64Array, n: number, k: number): void {
  const pivot = a[k * n + k]!;
  for (let i = k + 1; i < n; i++) {
    const l = a[i * n + k]! / pivot;
    a[i * n + k] = l;
    for (let j = k + 1; j < n; j++) a[i * n + j]! -= l * a[k * n + j]!;
  }
}

/** Right-looking elimination, exchanging row k with row pivotRow(a, k) before step k. */
function rightLooking(
  a0: ArrayLike<number>,
  n: number,
  pivotRow: (a: Float64Array, k: number) => number,
): LuOutcome {
  const a = Float64Array.from(a0);
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < n; k++) {
    const p = pivotRow(a, k);
    if (p !== k) swapRows(a, perm, n, k, p);
    if (a[k * n + k] === 0) return { lu: a, perm, zeroPivotAt: k };
    eliminate(a, n, k);
  }
  return { lu: a, perm };
}

/** GEPP; ties go to the first maximum ('first', LAPACK IDAMAX) or the last ('last', a `>=` scan). */
export function gepp(a0: ArrayLike<number>, n: number, tie: 'first' | 'last' = 'first'): LuOutcome {
  return rightLooking(a0, n, (a, k) => {
    let p = k;
    let best = Math.abs(a[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]!);
      if (tie === 'first' ? v > best : v >= best) {
        best = v;
        p = i;
      }
    }
    return p;
  });
}

/** Gaussian elimination without pivoting (right-looking). */
export function luNoPivot(a0: ArrayLike<number>, n: number): LuOutcome {
  return rightLooking(a0, n, (_, k) => k);
}

/**
 * GEPP in dot-product (Crout/Doolittle) order: each entry is a − (Σ l·u), the sum accumulated
 * first and subtracted once — a different rounding order from the right-looking form.
 */
export function geppDotProduct(a0: ArrayLike<number>, n: number): LuOutcome {
  const a = Float64Array.from(a0);
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < n; k++) {
    // Column k of the remaining rows: a_ik − Σ_{p<k} l_ip u_pk.
    for (let i = k; i < n; i++) {
      let s = 0;
      for (let p = 0; p < k; p++) s += a[i * n + p]! * a[p * n + k]!;
      a[i * n + k] = a[i * n + k]! - s;
    }
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]!) > Math.abs(a[p * n + k]!)) p = i;
    if (p !== k) swapRows(a, perm, n, k, p);
    const pivot = a[k * n + k]!;
    if (pivot === 0) return { lu: a, perm, zeroPivotAt: k };
    // Row k of U to the right: a_kj − Σ_{p<k} l_kp u_pj; multipliers below.
    for (let j = k + 1; j < n; j++) {
      let s = 0;
      for (let q = 0; q < k; q++) s += a[k * n + q]! * a[q * n + j]!;
      a[k * n + j] = a[k * n + j]! - s;
    }
    for (let i = k + 1; i < n; i++) a[i * n + k] = a[i * n + k]! / pivot;
  }
  return { lu: a, perm };
}

/** Cholesky A = LLᵀ (L with zeros above); failedAt is the step whose pivot was not positive. */
export function cholesky(a: ArrayLike<number>, n: number): { l: Float64Array; failedAt?: number } {
  const l = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j]!;
    for (let k = 0; k < j; k++) d -= l[j * n + k]! * l[j * n + k]!;
    if (!(d > 0)) return { l, failedAt: j };
    const ljj = Math.sqrt(d);
    l[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
      l[i * n + j] = s / ljj;
    }
  }
  return { l };
}

/**
 * LDLᵀ without pivoting: unit lower L (zeros above the diagonal) and d; zeroPivotAt is the step
 * whose d was exactly 0 (or not finite).
 */
export function ldlt(
  a: ArrayLike<number>,
  n: number,
): { l: Float64Array; d: Float64Array; zeroPivotAt?: number } {
  const l = new Float64Array(n * n);
  const d = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let dj = a[j * n + j]!;
    for (let k = 0; k < j; k++) dj -= l[j * n + k]! * l[j * n + k]! * d[k]!;
    d[j] = dj;
    if (dj === 0 || !Number.isFinite(dj)) return { l, d, zeroPivotAt: j };
    l[j * n + j] = 1;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]! * d[k]!;
      l[i * n + j] = s / dj;
    }
  }
  return { l, d };
}

/** Solves U x = b by back substitution, U upper triangular (entries below ignored). */
export function backSubstitute(
  u: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  const x = Float64Array.from(b);
  for (let i = n - 1; i >= 0; i--) {
    for (let j = i + 1; j < n; j++) x[i]! -= u[i * n + j]! * x[j]!;
    x[i]! /= u[i * n + i]!;
  }
  return x;
}

/** Solves A x = b from a packed PA = LU by forward and back substitution. */
export function luSolve(
  { lu, perm }: Pick<LuOutcome, 'lu' | 'perm'>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  const y = Float64Array.from({ length: n }, (_, i) => b[perm[i]!]!);
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) y[i]! -= lu[i * n + j]! * y[j]!;
  return backSubstitute(lu, y, n);
}
