import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import { clearlyNonsingular, expectations, factorIf } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { secondDifference } from '@sandbox/matrices/poisson-1d.ts';

/** Eigenvalue k (1-based) of T_n = tridiag(−1, 2, −1): 2 − 2cos(kπ/(n+1)) (references §4.8). */
function eigenvalue(k: number, n: number): number {
  return 2 - 2 * Math.cos((k * Math.PI) / (n + 1));
}

/**
 * The pivots of LDLᵀ (and LU) without pivoting of T_n − σI: d_1 = 2 − σ, d_k = (2 − σ) − 1/d_{k−1}
 * (Gaussian elimination on a symmetric tridiagonal matrix). Stops after an exact zero.
 */
function pivots(n: number, sigma: number): number[] {
  const d: number[] = [];
  let prev = 0;
  for (let k = 0; k < n; k++) {
    prev = k === 0 ? 2 - sigma : 2 - sigma - 1 / prev;
    d.push(prev);
    if (prev === 0) break;
  }
  return d;
}

/**
 * indefinite: T_n − σI (default σ = 2), symmetric and indefinite: σ must lie inside T_n's spectrum,
 * at least 0.01·λ_min(T_n) inside each end. Cholesky must reject it: A + ΔA with the backward error of a
 * computed Cholesky factor stays indefinite (Higham, ASNA 2nd ed., Thm 10.5, from memory). For
 * σ ∈ {1, 2, 3} elimination without pivoting meets an exact zero (σ = 2: a_11 = 0, references
 * §4.8, T₁₀ − 2I), in small integers, so LDLᵀ and LU without pivoting must reject; for other σ
 * they must factor when every pivot is well away from zero (|d_k| ≥ 1e-6), else they are left out.
 * T_n − σI is singular exactly when σ is an eigenvalue of T_n, which for a double σ means σ = 2
 * with n odd or σ ∈ {1, 3} with 3 | n+1 (Niven's theorem: cos(rπ) is rational only for 0, ±1/2,
 * ±1); GEPP then runs on multipliers 0, ±1, ±1/2 without rounding and meets an exact zero
 * (checked in the tests for n ≤ 60 and both tie rules), so GEPP and back substitution must reject.
 */
export const indefiniteFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: { sigma: { default: 2 } },
  check: ({ n, params }) => {
    if (n < 2) return 'indefinite needs n ≥ 2';
    const low = eigenvalue(1, n);
    const high = eigenvalue(n, n);
    const sigma = params.sigma!;
    return sigma >= 1.01 * low && sigma <= high - 0.01 * low
      ? undefined
      : `sigma must lie inside the spectrum of T_n: [${1.01 * low}, ${high - 0.01 * low}] for n = ${n}`;
  },
  build({ n, params }) {
    const sigma = params.sigma!;
    const data = secondDifference(n, sigma);
    const integral = sigma === 1 || sigma === 2 || sigma === 3;
    const singular = (sigma === 2 && n % 2 === 1) || (integral && sigma !== 2 && (n + 1) % 3 === 0);
    const d = pivots(n, sigma);
    const noPivot = integral ? 'reject' : factorIf(d.every((x) => Math.abs(x) >= 1e-6));
    const facts = exactFacts(data, n);
    let gap = Infinity;
    for (let k = 1; k <= n; k++) gap = Math.min(gap, Math.abs(eigenvalue(k, n) - sigma));
    // κ₂ = max|λ − σ| / min|λ − σ| ≤ 4/gap, and κ₁ ≤ n·κ₂.
    const safe = !singular && clearlyNonsingular(n, facts?.condition1 ?? (4 * n) / gap);
    return {
      data,
      properties: {
        positiveDefinite: false,
        singular,
        ...(facts?.condition1 !== undefined ? { exactCondition1: facts.condition1 } : {}),
        expectations: expectations({
          'lu-partial-pivoting': singular ? 'reject' : factorIf(safe),
          'lu-no-pivoting': noPivot,
          cholesky: 'reject',
          ldlt: noPivot,
          'householder-qr': 'factor',
          'back-substitution': singular ? 'reject' : factorIf(safe),
        }),
        note: `T_n − ${sigma}·I: symmetric indefinite; Cholesky must reject${integral ? ', and LDLᵀ without pivoting meets an exact zero pivot' : ''}.`,
      },
    };
  },
};
