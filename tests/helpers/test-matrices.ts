import { seededUniform } from '@tests/helpers/seeded-random.ts';

/**
 * Test matrices built in plain double, independent of the engine's generators (invented test
 * data where random, textbook definitions otherwise). Dense row-major: entry (i, j) of an m×n
 * matrix at a[i*n + j].
 */

/** An m×n matrix with seeded uniform(−1, 1) entries, drawn row by row. */
export function randomMatrix(m: number, n: number, seed: number): Float64Array {
  return Float64Array.from({ length: m * n }, seededUniform(seed));
}

/** Symmetric positive definite B·Bᵀ + n·I (B = randomMatrix(n, n, seed)), formed in double. */
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

/** Upper triangular with diagonal entries in [2, 3): well conditioned for back substitution. */
export function randomUpper(n: number, seed: number): Float64Array {
  const u = randomMatrix(n, n, seed);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) u[i * n + j] = 0;
    u[i * n + i] = 2.5 + u[i * n + i]! / 2;
  }
  return u;
}

/** The n×n Hilbert matrix rounded to double: h_ij = fl(1/(i + j + 1)), 0-based (hilb.m). */
export function hilbert(n: number): Float64Array {
  return Float64Array.from({ length: n * n }, (_, k) => 1 / (Math.floor(k / n) + (k % n) + 1));
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

/** The normalised 4×4 Hadamard matrix (a fresh copy): orthogonal, entries ±1/2, exact in binary. */
export function hadamard4(): Float64Array {
  return Float64Array.from([
    0.5, 0.5, 0.5, 0.5, 0.5, 0.5, -0.5, -0.5, 0.5, -0.5, 0.5, -0.5, 0.5, -0.5, -0.5, 0.5,
  ]);
}
