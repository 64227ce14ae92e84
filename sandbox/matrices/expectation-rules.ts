import type { Expectation, RoutineSlug } from '@shared/routines.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';

/** Per-routine expectations; a missing routine does not apply. */
export type Expectations = Partial<Record<RoutineSlug, Expectation>>;

/**
 * Whether an n×n matrix with κ₁ = condition1 is far enough from singular that no factorisation in
 * double meets an exactly zero pivot by rounding: 20·n^{5/2}·κ₁·u < 1. This is the sufficient
 * condition for Cholesky to run to completion, 20·n^{3/2}·κ₂(H)·u < 1 for the unit-diagonal
 * scaling H (Demmel 1989; Higham, ASNA 2nd ed., Thm 10.7, from memory), made independent of the
 * scaling with κ₂(H) ≤ n·κ₂(A) (van der Sluis 1969, from memory) and κ₂ ≤ κ₁ for symmetric A.
 * For LU and back substitution the same margin is used (common practice).
 */
export function clearlyNonsingular(n: number, condition1: number | undefined): boolean {
  return condition1 !== undefined && 20 * n ** 2.5 * condition1 * UNIT_ROUNDOFF < 1;
}

/** Keeps the routines whose expectation is given, dropping undefined and false. */
export function expectations(entries: {
  [K in RoutineSlug]?: Expectation | undefined | false;
}): Expectations {
  const out: Expectations = {};
  for (const [routine, value] of Object.entries(entries) as [
    RoutineSlug,
    Expectation | undefined | false,
  ][])
    if (value) out[routine] = value;
  return out;
}

/** 'factor' when ok is true, else undefined (the routine is left out). */
export function factorIf(ok: boolean): Expectation | undefined {
  return ok ? 'factor' : undefined;
}
