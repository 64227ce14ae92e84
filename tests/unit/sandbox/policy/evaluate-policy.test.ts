import { describe, expect, it } from 'vitest';
import { defaultAcceptancePolicy, acceptancePolicySchema } from '@shared/acceptance-policy.ts';
import type { Expectation, RoutineSlug } from '@shared/routines.ts';
import type { KernelOutcome, MatrixReport, TimingReport } from '@shared/trial-report.ts';
import { evaluatePolicy } from '@sandbox/policy/evaluate-policy.ts';
import { judgeMatrix } from '@sandbox/policy/judge-matrix.ts';

const ok = (metrics: KernelOutcome['metrics']): KernelOutcome => ({ status: 'ok', metrics, ms: 1 });

/** judgeMatrix under the default policy. */
const judge = (
  routine: RoutineSlug,
  expected: Expectation,
  outcome: KernelOutcome,
  referenceGrowth?: number,
) => judgeMatrix(routine, expected, outcome, defaultAcceptancePolicy, referenceGrowth);

function matrix(
  id: string,
  expected: 'factor' | 'reject',
  candidate: KernelOutcome,
  incumbent: KernelOutcome | null = null,
): MatrixReport {
  const { passed, failures } = judge('lu-partial-pivoting', expected, candidate);
  return {
    id,
    family: 'uniform',
    m: 4,
    n: 4,
    condition: 10,
    conditionKind: 'estimate',
    expected,
    referenceTrusted: true,
    referenceGrowth: 1,
    note: '',
    candidate,
    incumbent,
    passed,
    failures,
  };
}

function timing(
  n: number,
  ratio: number | null,
  verdict: TimingReport['verdict'],
  ci: [number, number] | null,
): TimingReport {
  return {
    n,
    rounds: 31,
    candidate: 1,
    incumbent: ratio === null ? null : 1 / ratio,
    candidateDetail: null,
    incumbentDetail: null,
    ratio,
    ci95: ci,
    pValue: null,
    verdict,
    flags: [],
  };
}

const rule = (result: ReturnType<typeof evaluatePolicy>, id: string) =>
  result.rules.find((r) => r.rule === id)!;

/** evaluatePolicy under the default policy. */
const evaluate = (matrices: MatrixReport[], timings: TimingReport[] = []) =>
  evaluatePolicy(matrices, timings, defaultAcceptancePolicy);

/** The versus-incumbent rule for one factored matrix with the two kernels' metrics. */
const versusIncumbent = (
  id: string,
  candidate: KernelOutcome['metrics'],
  incumbent: KernelOutcome['metrics'],
) => rule(evaluate([matrix(id, 'factor', ok(candidate), ok(incumbent))]), 'versus-incumbent');

describe('acceptance policy defaults', () => {
  it('uses LAPACK’s factor-ratio threshold 30 (dtest.in) and the product defaults', () => {
    expect(defaultAcceptancePolicy).toMatchObject({
      maxFactorRatio: 30,
      maxAccuracyLossFactor: 10,
      allowedSlowdown: 0.05,
      timingMargin: 0.03,
      requireRejections: true,
    });
    expect(acceptancePolicySchema.safeParse({ maxFactorRatio: -1 }).success).toBe(false);
    expect(acceptancePolicySchema.safeParse({ sneaky: 1 }).success).toBe(false);
  });
});

describe('judgeMatrix', () => {
  it('passes a factor ratio of 29 and fails 31, naming the value', () => {
    expect(judge('lu-partial-pivoting', 'factor', ok({ factorRatio: 29 })).passed).toBe(true);
    const bad = judge('lu-partial-pivoting', 'factor', ok({ factorRatio: 31 }));
    expect(bad.passed).toBe(false);
    expect(bad.failures[0]).toBe('factor ratio 31 exceeds 30');
  });

  it('needs a throw on a must-reject matrix and explains what happened instead', () => {
    expect(
      judge('cholesky', 'reject', { status: 'threw', message: 'not SPD', metrics: {}, ms: 1 })
        .passed,
    ).toBe(true);
    const silent = judge('cholesky', 'reject', {
      status: 'non-finite',
      message: 'l[4] is NaN',
      metrics: {},
      ms: 1,
    });
    expect(silent.passed).toBe(false);
    expect(silent.failures[0]).toContain('returned non-finite numbers: l[4] is NaN');
  });

  it('checks orthogonality for QR and the solve residual for back substitution', () => {
    expect(
      judge('householder-qr', 'factor', ok({ factorRatio: 1, orthogonalityRatio: 500 })).failures,
    ).toEqual(['orthogonality ratio 500 exceeds 30']);
    expect(judge('back-substitution', 'factor', ok({ solveResidualRatio: 2 })).passed).toBe(true);
    expect(judge('back-substitution', 'factor', ok({})).failures).toEqual([
      'solve residual ratio could not be computed',
    ]);
  });

  it('scales the factor-ratio threshold by the reference growth (Higham, ASNA Thm 9.5)', () => {
    const outcome = ok({ factorRatio: 5900 });
    expect(judge('lu-partial-pivoting', 'factor', outcome, 1).passed).toBe(false);
    const scaled = judge('lu-partial-pivoting', 'factor', outcome, 7e6);
    expect(scaled.passed).toBe(true);
    const beyond = judge('lu-partial-pivoting', 'factor', ok({ factorRatio: 1e9 }), 7e6);
    expect(beyond.failures).toEqual(['factor ratio 1.0e+9 exceeds 30 × reference growth 7.0e+6']);
  });

  it('treats a NaN or infinite ratio as a failure', () => {
    expect(judge('lu-no-pivoting', 'factor', ok({ factorRatio: NaN })).passed).toBe(false);
    expect(judge('lu-no-pivoting', 'factor', ok({ factorRatio: Infinity })).passed).toBe(false);
  });
});

describe('evaluatePolicy', () => {
  it('passes a clean trial with every rule explained', () => {
    const result = evaluate(
      [
        matrix('a', 'factor', ok({ factorRatio: 0.5 }), ok({ factorRatio: 0.4 })),
        matrix('s', 'reject', { status: 'threw', metrics: {}, ms: 0 }),
      ],
      [timing(64, 1.01, 'no clear difference', [0.99, 1.03])],
    );
    expect(result.passed).toBe(true);
    expect(result.rules.map((r) => r.rule)).toEqual([
      'factor-accuracy',
      'rejections',
      'versus-incumbent',
      'timing',
    ]);
    expect(result.rules.every((r) => r.reason.length > 10)).toBe(true);
  });

  it('fails versus-incumbent on a loss beyond 10× but not on noise below the floor', () => {
    const lossy = versusIncumbent(
      'hilbert-n8',
      { factorRatio: 12, forwardError: 1e-6 },
      { factorRatio: 0.3, forwardError: 1e-8 },
    );
    expect(lossy.passed).toBe(false);
    expect(lossy.offenders).toEqual(['hilbert-n8']);
    expect(lossy.reason).toContain('forwardError');
    // 1e-18 against 1e-17: both below u, so no loss is claimed.
    const tiny = versusIncumbent(
      'p',
      { factorRatio: 0.9, normwiseBackwardError: 1e-17 },
      { factorRatio: 0.01, normwiseBackwardError: 1e-18 },
    );
    expect(tiny.passed).toBe(true);
  });

  it('fails timing only when slower beyond the allowed slowdown', () => {
    const slow = evaluate([], [timing(256, 1.3, 'slower', [1.25, 1.35])]);
    expect(rule(slow, 'timing').passed).toBe(false);
    expect(rule(slow, 'timing').offenders).toEqual(['n=256']);
    const slight = evaluate([], [timing(256, 1.04, 'slower', [1.035, 1.045])]);
    expect(rule(slight, 'timing').passed).toBe(true);
  });

  it('fails rejections when a must-reject matrix returned numbers', () => {
    const result = evaluate([matrix('singular-n2', 'reject', ok({ factorRatio: 0 }))]);
    expect(result.passed).toBe(false);
    expect(rule(result, 'rejections').offenders).toEqual(['singular-n2']);
  });
});
