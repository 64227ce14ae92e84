/**
 * Small, plain factorisations and test matrices written for the metric tests (invented test
 * data; the algorithms are the textbook ones, Golub & Van Loan, 4th ed., §3.2, §3.4, §4.2, from
 * memory). Dense row-major n×n storage: entry (i, j) at a[i*n + j].
 */

/** Seeded uniform(−1, 1) numbers (mulberry32 generator, common practice for reproducible tests). */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) / 4294967296) * 2 - 1;
  };
}

export function randomMatrix(m: number, n: number, seed: number): Float64Array {
  const next = seededUniform(seed);
  return Float64Array.from({ length: m * n }, next);
}

/** Random symmetric positive definite B·Bᵀ + n·I (B uniform(−1, 1)), formed in double. */
export function randomSpd(n: number, seed: number): Float64Array {
  const b = randomMatrix(n, n, seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      let s = i === j ? n : 0;
      for (let k = 0; k < n; k++) s += b[i * n + k]! * b[j * n + k]!;
      a[i * n + j] = s;
      a[j * n + i] = s;
    }
  return a;
}

/**
 * Gaussian elimination with partial pivoting in double. tie = 'first' picks the first row of
 * maximal |a_ik| (LAPACK's IDAMAX rule), 'last' the last one (a `>=` scan). Returns packed
 * factors and perm with row i of PA = row perm[i] of A.
 */
export function gepp(
  a: ArrayLike<number>,
  n: number,
  tie: 'first' | 'last' = 'first',
): { lu: Float64Array; perm: Int32Array } {
  const lu = Float64Array.from(a);
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]!);
      const best = Math.abs(lu[p * n + k]!);
      if (tie === 'first' ? v > best : v >= best) p = i;
    }
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = lu[k * n + j]!;
        lu[k * n + j] = lu[p * n + j]!;
        lu[p * n + j] = t;
      }
      const t = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = t;
    }
    eliminate(lu, n, k);
  }
  return { lu, perm };
}

/** Gaussian elimination without pivoting in double; packed factors. */
export function luNoPivot(a: ArrayLike<number>, n: number): Float64Array {
  const lu = Float64Array.from(a);
  for (let k = 0; k < n; k++) eliminate(lu, n, k);
  return lu;
}

function eliminate(lu: Float64Array, n: number, k: number): void {
  for (let i = k + 1; i < n; i++) {
    const l = lu[i * n + k]! / lu[k * n + k]!;
    lu[i * n + k] = l;
    for (let j = k + 1; j < n; j++) lu[i * n + j] = lu[i * n + j]! - l * lu[k * n + j]!;
  }
}

/** Cholesky factor L (lower, zeros above) of an SPD matrix, column by column in double. */
export function choleskyDouble(a: ArrayLike<number>, n: number): Float64Array {
  const l = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j]!;
    for (let k = 0; k < j; k++) d -= l[j * n + k]! * l[j * n + k]!;
    const ljj = Math.sqrt(d);
    l[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
      l[i * n + j] = s / ljj;
    }
  }
  return l;
}

/**
 * Wilkinson's worst-growth matrix with parameter α: 1 on the diagonal, −α strictly below, 1 in
 * the last column (the GFPP matrix; Higham & Higham, SIAM J. Matrix Anal. Appl. 10 (1989)).
 */
export function worstGrowthMatrix(n: number, alpha = 1): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) a[i * n + j] = -alpha;
    a[i * n + i] = 1;
    a[i * n + n - 1] = 1;
  }
  return a;
}

/** Dense product of row-major matrices in double: (m×k)·(k×n). */
export function matmul(
  a: ArrayLike<number>,
  b: ArrayLike<number>,
  m: number,
  k: number,
  n: number,
): Float64Array {
  const c = new Float64Array(m * n);
  for (let i = 0; i < m; i++)
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let p = 0; p < k; p++) s += a[i * k + p]! * b[p * n + j]!;
      c[i * n + j] = s;
    }
  return c;
}

export function transpose(a: ArrayLike<number>, m: number, n: number): Float64Array {
  const t = new Float64Array(n * m);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) t[j * m + i] = a[i * n + j]!;
  return t;
}

/** LDLᵀ without pivoting in double: unit lower L (zeros above the diagonal) and d. */
export function ldltNoPivot(a: ArrayLike<number>, n: number): { l: Float64Array; d: Float64Array } {
  const l = new Float64Array(n * n);
  const d = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let dj = a[j * n + j]!;
    for (let k = 0; k < j; k++) dj -= l[j * n + k]! * l[j * n + k]! * d[k]!;
    d[j] = dj;
    l[j * n + j] = 1;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * d[k]! * l[j * n + k]!;
      l[i * n + j] = s / dj;
    }
  }
  return { l, d };
}

/** Back substitution for Ux = b, U upper triangular, in double. */
export function backSubstitute(
  u: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  const x = Float64Array.from(b);
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let j = i + 1; j < n; j++) s -= u[i * n + j]! * x[j]!;
    x[i] = s / u[i * n + i]!;
  }
  return x;
}
