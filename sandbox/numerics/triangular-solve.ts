/**
 * The harness's own trusted triangular solves, used so that accuracy metrics measure the
 * kernel's factors and not the kernel's solves. Dense row-major n×n storage: entry (i, j) is
 * t[i*n + j]; entries outside the triangle named by the function are never read. Each solve
 * costs n² flops and is the plain substitution of Golub & Van Loan, 4th ed., §3.1.
 * Inputs are not mutated; a new vector is returned.
 */

function checkSizes(t: ArrayLike<number>, b: ArrayLike<number>, n: number): void {
  if (!Number.isInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (t.length < n * n) throw new RangeError(`t must hold n*n = ${n * n} entries, has ${t.length}`);
  if (b.length !== n) throw new RangeError(`b must have length n = ${n}, has ${b.length}`);
}

/**
 * Solves T x = b for the n×n triangle T whose entry (i, j) is t[i*rowStride + j*colStride]: the
 * stored triangle itself (rowStride n, colStride 1) or its transpose (1, n). forward = true
 * substitutes from the first row (T lower), false from the last (T upper); with unit = true the
 * diagonal is taken as 1 and never read. Each x_i is b_i − Σ t_ij·x_j over j ascending, then
 * divided by t_ii, so every public solve keeps the rounding of its plain loop.
 */
function substitute(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
  rowStride: number,
  colStride: number,
  forward: boolean,
  unit: boolean,
): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let step = 0; step < n; step++) {
    const i = forward ? step : n - 1 - step;
    const from = forward ? 0 : i + 1;
    const to = forward ? i : n;
    let s = x[i]!;
    // k walks entry (i, j) of T through t.
    for (let j = from, k = i * rowStride + from * colStride; j < to; j++, k += colStride)
      s -= t[k]! * x[j]!;
    x[i] = unit ? s : s / t[i * (n + 1)]!;
  }
  return x;
}

/** Solves L x = b with L unit lower triangular (the strict lower part of t; diagonal taken as 1). */
export function solveLowerUnit(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  return substitute(t, b, n, n, 1, true, true);
}

/** Solves L x = b with L lower triangular including its diagonal. */
export function solveLower(t: ArrayLike<number>, b: ArrayLike<number>, n: number): Float64Array {
  return substitute(t, b, n, n, 1, true, false);
}

/** Solves U x = b with U upper triangular including its diagonal (back substitution). */
export function solveUpper(t: ArrayLike<number>, b: ArrayLike<number>, n: number): Float64Array {
  return substitute(t, b, n, n, 1, false, false);
}

/** Solves Lᵀ x = b with L lower triangular including its diagonal (reads the lower part). */
export function solveLowerTransposed(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  return substitute(t, b, n, 1, n, false, false);
}

/** Solves Lᵀ x = b with L unit lower triangular (strict lower part of t; diagonal taken as 1). */
export function solveLowerUnitTransposed(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  return substitute(t, b, n, 1, n, false, true);
}
