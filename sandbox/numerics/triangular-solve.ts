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

/** Solves L x = b with L unit lower triangular (the strict lower part of t; diagonal taken as 1). */
export function solveLowerUnit(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let i = 0; i < n; i++) {
    let s = x[i]!;
    const row = i * n;
    for (let j = 0; j < i; j++) s -= t[row + j]! * x[j]!;
    x[i] = s;
  }
  return x;
}

/** Solves L x = b with L lower triangular including its diagonal. */
export function solveLower(t: ArrayLike<number>, b: ArrayLike<number>, n: number): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let i = 0; i < n; i++) {
    let s = x[i]!;
    const row = i * n;
    for (let j = 0; j < i; j++) s -= t[row + j]! * x[j]!;
    x[i] = s / t[row + i]!;
  }
  return x;
}

/** Solves U x = b with U upper triangular including its diagonal (back substitution). */
export function solveUpper(t: ArrayLike<number>, b: ArrayLike<number>, n: number): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    const row = i * n;
    for (let j = i + 1; j < n; j++) s -= t[row + j]! * x[j]!;
    x[i] = s / t[row + i]!;
  }
  return x;
}

/** Solves Lᵀ x = b with L lower triangular including its diagonal (reads the lower part). */
export function solveLowerTransposed(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let j = i + 1; j < n; j++) s -= t[j * n + i]! * x[j]!;
    x[i] = s / t[i * n + i]!;
  }
  return x;
}

/** Solves Lᵀ x = b with L unit lower triangular (strict lower part of t; diagonal taken as 1). */
export function solveLowerUnitTransposed(
  t: ArrayLike<number>,
  b: ArrayLike<number>,
  n: number,
): Float64Array {
  checkSizes(t, b, n);
  const x = Float64Array.from(b);
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let j = i + 1; j < n; j++) s -= t[j * n + i]! * x[j]!;
    x[i] = s;
  }
  return x;
}
