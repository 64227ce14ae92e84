import { describe, expect, it } from 'vitest';
import { luFactorPartialPivoting, luSolve } from '@sandbox/reference/gepp.ts';
import { MAX_REFINEMENT_STEPS, refineSolution } from '@sandbox/reference/iterative-refinement.ts';

// An invented, well-conditioned 3×3 system with solution (1, −2, 0.5):
// A = [[4, 1, 0], [1, 5, 2], [0, 2, 6]], b = A·(1, −2, 0.5) = (2, −8, −1).
const A = [4, 1, 0, 1, 5, 2, 0, 2, 6];
const B = [2, -8, -1];
const X = [1, -2, 0.5];

function factorOk(a: ArrayLike<number>, n: number) {
  const f = luFactorPartialPivoting(a, n);
  if (!f.ok) throw new Error('unexpected zero pivot');
  return f;
}

describe('refineSolution', () => {
  it('converges from a poor start with an inexact correction solver', () => {
    // Corrections from the factors of a perturbed matrix A + 0.01·I: the error contracts by
    // ‖I − (A + 0.01I)⁻¹A‖₂ = 0.01/(λ_min + 0.01) < 0.005 per step, as A is symmetric with
    // λ_min ≥ 2 (Gershgorin); refinement theory: Higham, ASNA 2nd ed., ch. 12 (from memory).
    const p = A.map((v, k) => (k % 4 === 0 ? v + 0.01 : v));
    const f = factorOk(p, 3);
    const out = refineSolution(A, 3, B, [0, 0, 0], (r) => luSolve(f.lu, f.perm, r, 3));
    expect(out.converged).toBe(true);
    expect(out.steps).toBeGreaterThan(3);
    expect(out.steps).toBeLessThanOrEqual(MAX_REFINEMENT_STEPS);
    for (let i = 0; i < 3; i++) expect(Math.abs(out.x[i]! - X[i]!)).toBeLessThanOrEqual(2 ** -50);
  });

  it('stops after one step when the correction starts exact (d = 0)', () => {
    const f = factorOk(A, 3);
    const out = refineSolution(A, 3, B, X, (r) => luSolve(f.lu, f.perm, r, 3));
    expect(out).toEqual({ x: Float64Array.from(X), steps: 1, converged: true, lastCorrection: 0 });
  });

  it('stops unconverged, without applying it, when the correction does not halve', () => {
    // A solver returning 3× the true correction overshoots: errors double each step.
    const f = factorOk(A, 3);
    const x0 = [0, 0, 0];
    const out = refineSolution(A, 3, B, x0, (r) => luSolve(f.lu, f.perm, r, 3).map((v) => 3 * v));
    expect(out.converged).toBe(false);
    expect(out.steps).toBe(1);
    // After one step x = 3·x*, so the second (rejected) correction is −6·x*: ‖·‖∞ = 12.
    for (let i = 0; i < 3; i++) expect(out.x[i]).toBeCloseTo(3 * X[i]!, 12);
    expect(out.lastCorrection).toBeCloseTo(12, 12);
  });

  it('stops unconverged on a non-finite correction, and with maxSteps = 0', () => {
    const bad = refineSolution(A, 3, B, [0, 0, 0], () => Float64Array.from([NaN, 0, 0]));
    expect(bad.converged).toBe(false);
    expect(bad.steps).toBe(0);
    const none = refineSolution(A, 3, B, [1, 1, 1], () => new Float64Array(3), 0);
    expect(none).toEqual({
      x: Float64Array.from([1, 1, 1]),
      steps: 0,
      converged: false,
      lastCorrection: NaN,
    });
  });

  it('does not mutate x0 and rejects a bad maxSteps', () => {
    const x0 = Float64Array.from([0, 0, 0]);
    const f = factorOk(A, 3);
    refineSolution(A, 3, B, x0, (r) => luSolve(f.lu, f.perm, r, 3));
    expect(Array.from(x0)).toEqual([0, 0, 0]);
    expect(() => refineSolution(A, 3, B, x0, (r) => r, -1)).toThrow(/maxSteps/);
  });
});
