import { describe, expect, it } from 'vitest';
import type { RoutineSlug } from '@shared/routines.ts';
import { backSubstitutionBackwardErrorLimit, passesBound } from '@sandbox/metrics/metric-bounds.ts';
import type { MetricName } from '@sandbox/metrics/metric-names.ts';
import { computeMetrics, type MetricsInput } from '@sandbox/metrics/routine-metrics.ts';
import { matmul } from '@tests/helpers/dense-matrix.ts';
import { backSubstitute, cholesky, gepp, ldlt, luNoPivot } from '@tests/helpers/factorizations.ts';
import {
  hadamard4,
  randomMatrix,
  randomSpd,
  worstGrowthMatrix,
} from '@tests/helpers/test-matrices.ts';

const N = 12;
const SOLVE: MetricName[] = [
  'solveResidualRatio',
  'normwiseBackwardError',
  'componentwiseBackwardError',
];
const FORWARD: MetricName[] = ['forwardError', 'forwardErrorOverBound'];
// numerics.md, "Metrics per routine" (and the task's per-routine list).
const EXPECTED: Record<RoutineSlug, MetricName[]> = {
  'lu-partial-pivoting': [
    'factorRatio',
    'componentwiseBoundRatio',
    'growthFactor',
    ...SOLVE,
    ...FORWARD,
  ],
  'lu-no-pivoting': [
    'factorRatio',
    'componentwiseBoundRatio',
    'growthFactor',
    ...SOLVE,
    ...FORWARD,
  ],
  cholesky: ['factorRatio', 'componentwiseBoundRatio', ...SOLVE, ...FORWARD],
  ldlt: ['factorRatio', 'growthFactor', ...SOLVE, ...FORWARD],
  'householder-qr': ['factorRatio', 'orthogonalityRatio'],
  'back-substitution': [...SOLVE, ...FORWARD],
};

// An integer upper triangular R; with the Hadamard matrix as Q, A = QR exactly.
const R = Float64Array.of(2, 4, -6, 8, 0, 2, 4, -2, 0, 0, 6, 2, 0, 0, 0, 4);

/** A sound kernel's result for each routine, with b = A·x_true and x_ref = x_true. */
function soundCase(routine: RoutineSlug): MetricsInput {
  const xTrue = randomMatrix(N, 1, 99);
  const withRhs = (a: Float64Array, result: MetricsInput['result']): MetricsInput => ({
    routine,
    a,
    m: N,
    n: N,
    result,
    b: matmul(a, xTrue, N, N, 1),
    xRef: xTrue,
    referenceTrusted: true,
    condition: 100,
  });
  switch (routine) {
    case 'lu-partial-pivoting': {
      const a = randomMatrix(N, N, 1);
      return withRhs(a, gepp(a, N));
    }
    case 'lu-no-pivoting': {
      const a = randomSpd(N, 2); // no pivoting is safe on SPD matrices (Higham, ASNA §10.1, from memory)
      return withRhs(a, { lu: luNoPivot(a, N).lu });
    }
    case 'cholesky': {
      const a = randomSpd(N, 3);
      return withRhs(a, { l: cholesky(a, N).l });
    }
    case 'ldlt': {
      const a = randomSpd(N, 4);
      return withRhs(a, ldlt(a, N));
    }
    case 'householder-qr':
      // Fresh copies: the garbage-factor test overwrites the result's arrays.
      return {
        routine,
        a: matmul(hadamard4(), R, 4, 4, 4),
        m: 4,
        n: 4,
        result: { q: hadamard4(), r: Float64Array.from(R) },
        b: new Float64Array(4),
      };
    case 'back-substitution': {
      const u = randomMatrix(N, N, 5).map((v, k) =>
        k % N < Math.floor(k / N) ? 0 : k % (N + 1) === 0 ? v + 4 : v,
      );
      const input = withRhs(u, { x: new Float64Array(N) });
      input.result = { x: backSubstitute(u, input.b!, N) };
      return input;
    }
  }
}

const ROUTINES = Object.keys(EXPECTED) as RoutineSlug[];

describe('computeMetrics', () => {
  it('returns exactly the metrics that apply to each routine', () => {
    for (const routine of ROUTINES)
      expect(Object.keys(computeMetrics(soundCase(routine))).sort()).toEqual(
        [...EXPECTED[routine]].sort(),
      );
  });

  it('gives sound kernels passing scores', () => {
    // LAPACK's threshold 30 (dtest.in), healthy kernels sit far below it (numerics-references
    // §1.4); Thm 9.3/10.3 ratios ≤ 1 (§2.4); back substitution ω ≤ γ_n (Higham Thm 8.5).
    for (const routine of ROUTINES) {
      const metrics = computeMetrics(soundCase(routine));
      for (const [name, value] of Object.entries(metrics) as [MetricName, number][]) {
        expect(passesBound(name, value) ?? true, `${routine} ${name} = ${value}`).toBe(true);
        if (name === 'normwiseBackwardError') expect(value).toBeLessThan(N * 2 ** -53 * 10);
      }
      if (routine === 'back-substitution')
        expect(metrics.componentwiseBackwardError).toBeLessThanOrEqual(
          backSubstitutionBackwardErrorLimit(N),
        );
    }
  });

  it('gives forward metrics only for a trusted reference, and the bound only with a condition', () => {
    const base = soundCase('lu-partial-pivoting');
    const has = (input: MetricsInput) => FORWARD.filter((k) => k in computeMetrics(input));
    expect(has({ ...base, referenceTrusted: false })).toEqual([]);
    expect(has({ ...base, referenceTrusted: undefined })).toEqual([]);
    expect(has({ ...base, xRef: undefined })).toEqual([]);
    expect(has({ ...base, condition: undefined })).toEqual(['forwardError']);
    expect(Object.keys(computeMetrics({ ...base, b: undefined })).sort()).toEqual([
      'componentwiseBoundRatio',
      'factorRatio',
      'growthFactor',
    ]);
  });

  it('scores the worst-growth matrix at n = 60: accurate factor ratio, growth 2^59, forward error 1', () => {
    // numerics-references §3 and §11 rows 7, 11, 12: GEPP's exact factors, growth 2^59, and the
    // solution of Wx = W·1 is 100 % wrong for n ≥ 55; the factor residual is exactly 0.
    const n = 60;
    const a = worstGrowthMatrix(n);
    const ones = new Float64Array(n).fill(1);
    const metrics = computeMetrics({
      routine: 'lu-partial-pivoting',
      a,
      m: n,
      n,
      result: gepp(a, n),
      b: matmul(a, ones, n, n, 1),
      xRef: ones,
      referenceTrusted: true,
    });
    expect(metrics.factorRatio).toBeLessThan(1);
    expect(metrics.growthFactor).toBe(2 ** 59);
    expect(metrics.forwardError).toBe(1);
  });

  it('never returns NaN for garbage factors (NaN, ±Infinity, 1e308) and fails the factor ratio', () => {
    for (const routine of ROUTINES) {
      for (const bad of [NaN, Infinity, -Infinity, 1e308]) {
        for (const everywhere of [false, true]) {
          const input = soundCase(routine);
          const result = input.result as unknown as Record<string, unknown>;
          for (const value of Object.values(result))
            if (value instanceof Float64Array) {
              if (everywhere) value.fill(bad);
              else value[0] = bad;
            }
          const metrics = computeMetrics(input);
          for (const [name, v] of Object.entries(metrics)) {
            expect(Number.isNaN(v), `${routine} ${name} with ${bad}`).toBe(false);
            expect(v).toBeGreaterThanOrEqual(0);
          }
          if (metrics.factorRatio !== undefined)
            expect(metrics.factorRatio).toBeGreaterThanOrEqual(30);
          else expect(metrics.normwiseBackwardError).toBeGreaterThan(1e-6);
        }
      }
    }
  });

  it('rejects malformed input', () => {
    const lu = soundCase('lu-partial-pivoting');
    expect(() => computeMetrics({ ...lu, m: N + 1 })).toThrow(RangeError);
    expect(() => computeMetrics({ ...lu, routine: 'cholesky' })).toThrow(TypeError);
    expect(() => computeMetrics({ ...soundCase('back-substitution'), b: undefined })).toThrow(
      TypeError,
    );
  });
});
