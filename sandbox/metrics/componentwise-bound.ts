/**
 * Componentwise backward-error bound ratios of a factorisation: how much of the rounding-error
 * bound with no hidden constant a kernel's residual uses. Dense row-major n×n storage: entry
 * (i, j) at a[i*n + j]. A kernel that performs the standard elimination operations in any
 * order satisfies the bound, so a sound kernel scores ≤ 1 with an accurate residual.
 * Cost n³/3 (LU) or n³/6 (Cholesky) plain multiply-adds for |L||U|, plus the residual's cost.
 */
import { gamma } from '@sandbox/numerics/unit-roundoff.ts';
import { choleskyResidual, luResidual, type FactorResidual } from './factor-residual.ts';
import { checkLength } from './argument-checks.ts';
import { ratioOrWorst } from './safe-ratio.ts';

/**
 * max_ij |PA − LU|_ij / (γ_n·(|L||U|)_ij) with 0/0 := 0 and (nonzero)/0 := ∞; ≤ 1 for any
 * computed LU factorisation (Higham, ASNA 2nd ed., Thm 9.3, from memory: L̂Û = A + ΔA with
 * |ΔA| ≤ γ_n|L̂||Û|; γ_n = nu/(1 − nu), §3.1). Layout of lu and perm as in luResidual; pass a
 * residual already computed by luResidual to avoid computing it twice. The denominator is
 * rounded (relative error ≤ γ_n), far below what separates sound kernels (≲ 0.1) from wrong ones.
 */
export function luComponentwiseBoundRatio(
  a: ArrayLike<number>,
  n: number,
  lu: ArrayLike<number>,
  perm?: ArrayLike<number>,
  residual: FactorResidual = luResidual(a, n, lu, perm),
): number {
  checkLength('lu', lu, n * n);
  checkResidualShape(residual, n);
  const sigma = residual.scale;
  const g = gamma(n);
  // |L| with its unit diagonal, and |σU| transposed, so that both are read with stride 1.
  const la = new Float64Array(n * n);
  const ut = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) la[i * n + j] = Math.abs(lu[i * n + j]!);
    la[i * n + i] = 1;
    for (let j = i; j < n; j++) ut[j * n + i] = Math.abs(sigma * lu[i * n + j]!);
  }
  let worst = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      // (|L||σU|)_ij = Σ_{k ≤ min(i,j)} |l_ik|·|σu_kj|.
      let den = 0;
      for (let k = 0, kEnd = Math.min(i, j); k <= kEnd; k++) den += la[i * n + k]! * ut[j * n + k]!;
      worst = Math.max(worst, ratioOrWorst(Math.abs(residual.r[i * n + j]!), g * den));
    }
  }
  return worst;
}

/**
 * max_{i≥j} |A − LLᵀ|_ij / (γ_{n+1}·(|L||Lᵀ|)_ij) with 0/0 := 0; ≤ 1 for any computed
 * Cholesky factor (Higham, ASNA 2nd ed., Thm 10.3, from memory: R̂ᵀR̂ = A + ΔA with
 * |ΔA| ≤ γ_{n+1}|R̂ᵀ||R̂|). Symmetric, so the lower triangle is enough; l as in choleskyResidual.
 */
export function choleskyComponentwiseBoundRatio(
  a: ArrayLike<number>,
  n: number,
  l: ArrayLike<number>,
  residual: FactorResidual = choleskyResidual(a, n, l),
): number {
  checkLength('l', l, n * n);
  checkResidualShape(residual, n);
  // The residual is scaled by σ² with σ a power of two, so σ = √(σ²) exactly.
  const sigma = Math.sqrt(residual.scale);
  const g = gamma(n + 1);
  let worst = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let den = 0;
      for (let k = 0; k <= j; k++)
        den += Math.abs(sigma * l[i * n + k]!) * Math.abs(sigma * l[j * n + k]!);
      worst = Math.max(worst, ratioOrWorst(Math.abs(residual.r[i * n + j]!), g * den));
    }
  }
  return worst;
}

function checkResidualShape(residual: FactorResidual, n: number): void {
  if (residual.rows !== n || residual.cols !== n)
    throw new RangeError(`residual must be ${n}×${n}, is ${residual.rows}×${residual.cols}`);
}
