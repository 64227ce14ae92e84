import { factorableGeneralProperties } from '@sandbox/matrices/factorable-general-properties.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';

/**
 * kahan: K = diag(1, s, …, s^{n−1})·(I − c·N) with s = sin θ, c = cos θ and N the strict upper
 * triangle of ones (Higham's convention, Test Matrix Toolbox kahan.m, default θ = 1.2, read there;
 * references §4.7 — Burkardt's kahan.py starts the diagonal at s instead). The toolbox's optional
 * diagonal perturbation, which only matters for QR with column pivoting, is not applied. Row i
 * (0-based) holds d_i = s^i (repeated multiplication) on the diagonal and −c·d_i to its right;
 * sin and cos rely on V8's fdlibm-derived Math.sin/Math.cos for the same bits everywhere (from
 * memory). K is upper triangular, so LU with or without pivoting returns K itself with no rounding,
 * yet its smallest singular value hides from the diagonal: at n = 100 the smallest diagonal entry
 * is 9.4e-4 while σ_min ≈ 8.9e-17 (references §4.7).
 */
export const kahanFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {
    theta: {
      default: 1.2,
      check: (v) => (v > 0 && v < Math.PI / 2 ? undefined : 'theta must be in (0, π/2)'),
    },
  },
  check: ({ n, params }) =>
    (n - 1) * Math.log10(Math.sin(params.theta!)) < -300
      ? 'kahan needs sin(theta)^(n−1) ≥ 1e-300 (smaller diagonal entries underflow)'
      : undefined,
  build({ n, params }) {
    const s = Math.sin(params.theta!);
    const c = Math.cos(params.theta!);
    const data = new Float64Array(n * n);
    let d = 1;
    for (let i = 0; i < n; i++) {
      data[i * n + i] = d;
      for (let j = i + 1; j < n; j++) data[i * n + j] = -c * d;
      d *= s;
    }
    return {
      data,
      properties: factorableGeneralProperties(
        data,
        n,
        `Kahan matrix (θ = ${params.theta}): upper triangular, the diagonal hides near-singularity; zero sub-columns for QR.`,
      ),
    };
  },
};
