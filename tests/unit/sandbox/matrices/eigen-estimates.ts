import { matmul } from '@tests/helpers/dense-matrix.ts';
import { cholesky } from '@tests/helpers/factorizations.ts';

/**
 * Extreme eigenvalues of a symmetric positive definite matrix for the tests: the power method
 * with Rayleigh quotients for λ_max and inverse iteration through a Cholesky factor for λ_min
 * (Golub & Van Loan, 4th ed., §8.2.1 and §8.2.2). Row-major n×n.
 */
export function extremeEigenvalues(
  a: ArrayLike<number>,
  n: number,
  iterations = 400,
): { min: number; max: number } {
  const { l, failedAt } = cholesky(a, n);
  if (failedAt !== undefined) throw new Error(`not positive definite (step ${failedAt})`);
  const multiply = (x: Float64Array) => matmul(a, x, n, n, 1);
  const solve = (b: Float64Array) => {
    const y = Float64Array.from(b);
    for (let i = 0; i < n; i++) {
      for (let k = 0; k < i; k++) y[i]! -= l[i * n + k]! * y[k]!;
      y[i]! /= l[i * n + i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      for (let k = i + 1; k < n; k++) y[i]! -= l[k * n + i]! * y[k]!;
      y[i]! /= l[i * n + i]!;
    }
    return y;
  };
  const iterate = (step: (x: Float64Array) => Float64Array) => {
    let x = Float64Array.from({ length: n }, (_, i) => 1 + i / n);
    let rho = 0;
    for (let k = 0; k < iterations; k++) {
      const y = step(x);
      let xy = 0;
      let xx = 0;
      let yy = 0;
      for (let i = 0; i < n; i++) {
        xy += x[i]! * y[i]!;
        xx += x[i]! * x[i]!;
        yy += y[i]! * y[i]!;
      }
      rho = xy / xx;
      const norm = Math.sqrt(yy);
      x = y.map((v) => v / norm);
    }
    return rho;
  };
  return { max: iterate(multiply), min: 1 / iterate(solve) };
}
