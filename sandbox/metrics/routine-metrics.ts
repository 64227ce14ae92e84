/**
 * The metrics one kernel result earns on one matrix, per routine (numerics.md, "Metrics per
 * routine"). Dense row-major storage: entry (i, j) of the m×n matrix A at a[i*n + j]; layouts of
 * the results as in sandbox/contracts/kernel-results.ts. Cost dominated by the accurate factor
 * residual: O(n³) compensated multiply-adds (O(m·n²) for QR), O(n²) for back substitution.
 */
import type { RoutineSlug } from '@shared/routines.ts';
import { checkDimension } from './argument-checks.ts';
import {
  componentwiseBackwardError,
  normwiseBackwardError,
  solveResidualRatio,
} from './backward-error.ts';
import {
  choleskyComponentwiseBoundRatio,
  luComponentwiseBoundRatio,
} from './componentwise-bound.ts';
import {
  choleskyResidual,
  factorRatio,
  ldltResidual,
  luResidual,
  qrResidual,
} from './factor-residual.ts';
import { forwardError, forwardErrorOverBound } from './forward-error.ts';
import { ldltGrowthFactor, luGrowthFactor } from './growth-factor.ts';
import type { MetricName, Metrics } from './metric-names.ts';
import { orthogonalityRatio } from './orthogonality.ts';
import {
  asCholeskyResult,
  asLdltResult,
  asLuResult,
  asQrResult,
  type KernelResult,
} from './result-shape.ts';
import { scaledSolveResidual } from './solve-residual.ts';
import { solveWithFactors } from './solve-with-factors.ts';

export interface MetricsInput {
  routine: RoutineSlug;
  /** The matrix handed to the kernel (for back substitution: U; its strict lower part is ignored). */
  a: Float64Array;
  m: number;
  n: number;
  result: KernelResult;
  /** Right-hand side; the solve metrics need it (required for back substitution). */
  b?: Float64Array;
  /** The reference solver's solution of Ax = b. */
  xRef?: Float64Array;
  /** Whether xRef can be trusted; forward-error metrics only when true. */
  referenceTrusted?: boolean;
  /** κ∞(A), exact or estimated; forwardErrorOverBound only when given. */
  condition?: number;
}

/**
 * Exactly the metrics that apply: factor metrics per routine (LU: factor ratio, componentwise
 * bound ratio, growth; Cholesky: factor ratio, componentwise bound ratio; LDLᵀ: factor ratio,
 * growth; QR: factor ratio, orthogonality), then for all but QR, when b is given, the solve
 * metrics of x̂ from the factors (solve residual ratio, normwise and componentwise backward
 * error), and forward error (over its bound when `condition` is given) when xRef is given and
 * trusted. LU without pivoting ignores any perm (its contract is A = LU). No value is ever NaN:
 * what cannot be computed is Infinity. Throws RangeError/TypeError for malformed arguments.
 */
export function computeMetrics(input: MetricsInput): Metrics {
  const { routine, a, m, n, result } = input;
  checkDimension('m', m);
  checkDimension('n', n);
  if (routine !== 'householder-qr' && m !== n)
    throw new RangeError(`m must equal n for ${routine}, got m = ${m}, n = ${n}`);
  const metrics: Metrics = {};
  switch (routine) {
    case 'lu-partial-pivoting':
    case 'lu-no-pivoting': {
      const { lu, perm: kernelPerm } = asLuResult(result);
      const perm = routine === 'lu-partial-pivoting' ? kernelPerm : undefined;
      const residual = luResidual(a, n, lu, perm);
      metrics.factorRatio = factorRatio(residual, n);
      metrics.componentwiseBoundRatio = luComponentwiseBoundRatio(a, n, lu, perm, residual);
      metrics.growthFactor = luGrowthFactor(a, n, lu);
      break;
    }
    case 'cholesky': {
      const { l } = asCholeskyResult(result);
      const residual = choleskyResidual(a, n, l);
      metrics.factorRatio = factorRatio(residual, n);
      metrics.componentwiseBoundRatio = choleskyComponentwiseBoundRatio(a, n, l, residual);
      break;
    }
    case 'ldlt': {
      const { l, d } = asLdltResult(result);
      metrics.factorRatio = factorRatio(ldltResidual(a, n, l, d), n);
      metrics.growthFactor = ldltGrowthFactor(a, n, l, d);
      break;
    }
    case 'householder-qr': {
      const { q, r } = asQrResult(result);
      metrics.factorRatio = factorRatio(qrResidual(a, m, n, q, r), Math.max(1, m));
      metrics.orthogonalityRatio = orthogonalityRatio(q, m, n);
      return noNaN(metrics);
    }
    case 'back-substitution':
      if (input.b === undefined) throw new TypeError('b is required for back-substitution');
      break;
  }
  if (input.b !== undefined) addSolveMetrics(metrics, input, input.b);
  return noNaN(metrics);
}

function addSolveMetrics(metrics: Metrics, input: MetricsInput, b: Float64Array): void {
  const { routine, n } = input;
  const x = solveWithFactors(routine, input.result, b, n);
  if (x === undefined) return;
  const a = routine === 'back-substitution' ? upperTriangle(input.a, n) : input.a;
  const s = scaledSolveResidual(a, n, x, b);
  metrics.solveResidualRatio = solveResidualRatio(a, n, x, b, s);
  metrics.normwiseBackwardError = normwiseBackwardError(a, n, x, b, s);
  metrics.componentwiseBackwardError = componentwiseBackwardError(a, n, x, b, s);
  if (input.xRef === undefined || input.referenceTrusted !== true) return;
  const fe = forwardError(x, input.xRef);
  metrics.forwardError = fe;
  if (input.condition !== undefined)
    metrics.forwardErrorOverBound = forwardErrorOverBound(fe, input.condition);
}

/** U = the upper triangle of a (the kernel's contract reads only U), zeros below. */
function upperTriangle(a: Float64Array, n: number): Float64Array {
  if (a.length !== n * n) throw new RangeError(`a must hold ${n * n} entries, has ${a.length}`);
  const u = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) u[i * n + j] = a[i * n + j]!;
  return u;
}

/** Last guard of the contract "never NaN": every module already maps NaN to Infinity. */
function noNaN(metrics: Metrics): Metrics {
  for (const name of Object.keys(metrics) as MetricName[])
    if (Number.isNaN(metrics[name])) metrics[name] = Infinity;
  return metrics;
}
