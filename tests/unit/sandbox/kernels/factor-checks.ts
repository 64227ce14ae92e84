import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';

/**
 * Test helpers: seeded matrices and plain-double residual ratios for checking a kernel's
 * factors loosely. Dense row-major: entry (i, j) of an m×n matrix is a[i*n + j]. The ratios
 * follow LAPACK's test ratios (dget01, dpot01, dsyt01, dqrt01/dqrt02): a sound kernel on a
 * well-conditioned matrix gives a ratio of order 1; the pass threshold is 30 (dtest.in).
 */
export const RATIO_THRESHOLD = 30;

/** Mulberry32 (a public-domain 32-bit generator), uniform in [−1, 1). */
export function seededUniform(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) / 4294967296) * 2 - 1;
  };
}

export function randomMatrix(m: number, n: number, seed: number): Float64Array {
  const next = seededUniform(seed);
  return Float64Array.from({ length: m * n }, next);
}

/** BᵀB + nI with B uniform: symmetric positive definite and well conditioned. */
export function randomSpd(n: number, seed: number): Float64Array {
  const b = randomMatrix(n, n, seed);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = i === j ? n : 0;
      for (let k = 0; k < n; k++) s += b[k * n + i]! * b[k * n + j]!;
      a[i * n + j] = s;
    }
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

/** ‖M‖₁, the largest column sum of |M| for an m×n M. */
export function norm1(a: ArrayLike<number>, m: number, n: number): number {
  let best = 0;
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let i = 0; i < m; i++) s += Math.abs(a[i * n + j]!);
    best = Math.max(best, s);
  }
  return best;
}

/** C = X·Y with X m×k and Y k×n, where get(i, j) reads the factors in their packed forms. */
function product(
  m: number,
  k: number,
  n: number,
  x: (i: number, p: number) => number,
  y: (p: number, j: number) => number,
): Float64Array {
  const c = new Float64Array(m * n);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let p = 0; p < k; p++) s += x(i, p) * y(p, j);
      c[i * n + j] = s;
    }
  }
  return c;
}

function differenceRatio(a: Float64Array, c: Float64Array, m: number, n: number, scale: number) {
  const d = a.map((v, i) => v - c[i]!);
  return norm1(d, m, n) / (scale * norm1(a, m, n) * UNIT_ROUNDOFF);
}

const unitLower = (f: ArrayLike<number>, n: number) => (i: number, j: number) =>
  i === j ? 1 : j < i ? f[i * n + j]! : 0;
const upper = (f: ArrayLike<number>, n: number) => (i: number, j: number) =>
  j >= i ? f[i * n + j]! : 0;

/** ‖PA − LU‖₁ / (n‖A‖₁u), LAPACK dget01; perm undefined means P = I. */
export function luRatio(
  a: Float64Array,
  lu: Float64Array,
  perm: Int32Array | undefined,
  n: number,
) {
  const pa = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const from = perm ? perm[i]! : i;
    pa.set(a.subarray(from * n, from * n + n), i * n);
  }
  return differenceRatio(pa, product(n, n, n, unitLower(lu, n), upper(lu, n)), n, n, n);
}

/** ‖A − LLᵀ‖₁ / (n‖A‖₁u), LAPACK dpot01 (L's upper part ignored). */
export function choleskyRatio(a: Float64Array, l: Float64Array, n: number) {
  const low = (i: number, j: number) => (j <= i ? l[i * n + j]! : 0);
  return differenceRatio(
    a,
    product(n, n, n, low, (p, j) => low(j, p)),
    n,
    n,
    n,
  );
}

/** ‖A − LDLᵀ‖₁ / (n‖A‖₁u), LAPACK dsyt01 style (L unit lower from its strict part). */
export function ldltRatio(a: Float64Array, l: Float64Array, d: Float64Array, n: number) {
  const low = unitLower(l, n);
  const c = product(
    n,
    n,
    n,
    (i, p) => low(i, p) * d[p]!,
    (p, j) => low(j, p),
  );
  return differenceRatio(a, c, n, n, n);
}

/** ‖A − QR‖₁ / (m‖A‖₁u) and ‖I − QᵀQ‖₁ / (m·u), LAPACK dqrt02 and dqrt01. */
export function qrRatios(a: Float64Array, q: Float64Array, r: Float64Array, m: number, n: number) {
  const factor = differenceRatio(
    a,
    product(m, n, n, (i, p) => q[i * n + p]!, upper(r, n)),
    m,
    n,
    m,
  );
  const qtq = product(
    n,
    m,
    n,
    (i, p) => q[p * n + i]!,
    (p, j) => q[p * n + j]!,
  );
  for (let i = 0; i < n; i++) qtq[i * n + i] = qtq[i * n + i]! - 1;
  return { factor, orthogonality: norm1(qtq, n, n) / (m * UNIT_ROUNDOFF) };
}

/** ‖b − Ux‖₁ / (‖U‖₁‖x‖₁u), LAPACK dget02 style. */
export function solveRatio(u: Float64Array, b: Float64Array, x: Float64Array, n: number) {
  const ux = product(n, n, 1, upper(u, n), (p) => x[p]!);
  const r = b.map((v, i) => v - ux[i]!);
  return norm1(r, n, 1) / (norm1(u, n, n) * norm1(x, n, 1) * UNIT_ROUNDOFF);
}
