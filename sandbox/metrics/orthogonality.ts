/**
 * Loss of orthogonality of a thin Q from a QR factorisation. Dense row-major m×n storage:
 * entry (i, j) at q[i*n + j].
 */
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { checkDimension, checkLength } from './argument-checks.ts';
import { residualDot2 } from './accurate-product.ts';
import { worstIfNaN } from './safe-ratio.ts';
import { symmetricNorm1Lower } from './symmetric-norm.ts';

/**
 * ‖I − QᵀQ‖₁ / (max(1, m)·u) for Q m×n (LAPACK TESTING/LIN dqrt01 and dqrt02, result 2;
 * u = DLAMCH('E') = 2^-53). Cost m·n²/2 compensated multiply-adds. Method: I − QᵀQ is symmetric,
 * so only its lower triangle is formed, each entry δ_ij − Σ_k q_ki·q_kj in Dot2 (Ogita, Rump &
 * Oishi 2005; LAPACK uses DSYRK in double), and measured with the symmetric 1-norm (DLANSY('1')).
 * 0 for an exactly orthonormal Q; ∞ when an entry is not finite (never NaN).
 */
export function orthogonalityRatio(q: ArrayLike<number>, m: number, n: number): number {
  checkDimension('m', m);
  checkDimension('n', n);
  checkLength('q', q, m * n);
  const e = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++)
      e[i * n + j] = residualDot2(i === j ? 1 : 0, 0, m, q, i, n, q, j, n);
  return worstIfNaN(symmetricNorm1Lower(e, n) / Math.max(1, m) / UNIT_ROUNDOFF);
}
