/**
 * Small, plainly written factorisations for the matrix tests (not the engine's reference solver):
 * right-looking Gaussian elimination with and without partial pivoting (Golub & Van Loan, 4th ed.,
 * Alg. 3.4.1 and 3.2.1), a dot-product (Crout-like) variant, Cholesky (GVL Alg. 4.2.1) and LDLᵀ
 * without pivoting (GVL Alg. 4.1.2). Row-major n×n, entry (i, j) at a[i*n + j]; inputs untouched.
 */

export interface LuOutcome {
  /** L (strict lower, unit diagonal implied) and U packed. */
  lu: Float64Array;
  /** Row i of PA is row perm[i] of A. */
  perm: Int32Array;
  /** Step (0-based) at which an exactly zero pivot was met; undefined when none. */
  zeroPivotAt?: number;
}

/** GEPP; ties go to the first maximum ('first', LAPACK IDAMAX) or the last ('last', a `>=` scan). */
export function gepp(a0: ArrayLike<number>, n: number, tie: 'first' | 'last' = 'first'): LuOutcome {
  const a = Float64Array.from(a0);
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[i * n + k]!);
      if (tie === 'first' ? v > best : v >= best) {
        best = v;
        p = i;
      }
    }
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    const pivot = a[k * n + k]!;
    if (pivot === 0) return { lu: a, perm, zeroPivotAt: k };
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      a[i * n + k] = l;
      for (let j = k + 1; j < n; j++) a[i * n + j]! -= l * a[k * n + j]!;
    }
  }
  return { lu: a, perm };
}

/** Gaussian elimination without pivoting (right-looking). */
export function luNoPivot(a0: ArrayLike<number>, n: number): LuOutcome {
  const a = Float64Array.from(a0);
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < n; k++) {
    const pivot = a[k * n + k]!;
    if (pivot === 0) return { lu: a, perm, zeroPivotAt: k };
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k]! / pivot;
      a[i * n + k] = l;
      for (let j = k + 1; j < n; j++) a[i * n + j]! -= l * a[k * n + j]!;
    }
  }
  return { lu: a, perm };
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
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
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

/** Cholesky A = LLᵀ; failedAt is the step whose pivot was not positive (or NaN). */
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

/** LDLᵀ without pivoting; zeroPivotAt is the step whose d was exactly 0 (or not finite). */
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

/** The diagonal of U from a packed LU. */
export function pivotsOf(lu: Float64Array, n: number): number[] {
  return Array.from({ length: n }, (_, k) => lu[k * n + k]!);
}

/** max|u_ij| / max|a_ij|, the U-based growth factor (Higham, ASNA 2nd ed., §9.3). */
export function growthFactor(lu: Float64Array, a: ArrayLike<number>, n: number): number {
  let maxU = 0;
  let maxA = 0;
  for (let i = 0; i < n; i++)
    for (let j = i; j < n; j++) maxU = Math.max(maxU, Math.abs(lu[i * n + j]!));
  for (let k = 0; k < n * n; k++) maxA = Math.max(maxA, Math.abs(a[k]!));
  return maxU / maxA;
}

/** Solves A x = b from a packed PA = LU by forward and back substitution. */
export function luSolve(out: LuOutcome, b: ArrayLike<number>, n: number): Float64Array {
  const { lu, perm } = out;
  const x = Float64Array.from({ length: n }, (_, i) => b[perm[i]!]!);
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) x[i]! -= lu[i * n + j]! * x[j]!;
  for (let i = n - 1; i >= 0; i--) {
    for (let j = i + 1; j < n; j++) x[i]! -= lu[i * n + j]! * x[j]!;
    x[i]! /= lu[i * n + i]!;
  }
  return x;
}

/** A·x in plain double, row by row. */
export function matVec(
  a: ArrayLike<number>,
  x: ArrayLike<number>,
  m: number,
  n: number,
): Float64Array {
  const y = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += a[i * n + j]! * x[j]!;
    y[i] = s;
  }
  return y;
}
