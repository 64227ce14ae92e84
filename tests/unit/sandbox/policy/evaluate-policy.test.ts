import { describe, expect, it } from 'vitest';
import { defaultAcceptancePolicy, acceptancePolicySchema } from '@shared/acceptance-policy.ts';
import type { KernelOutcome, MatrixReport, TimingReport } from '@shared/trial-report.ts';
import { evaluatePolicy } from '@sandbox/policy/evaluate-policy.ts';
import { judgeMatrix } from '@sandbox/policy/judge-matrix.ts';

const ok = (metrics: KernelOutcome['metrics']): KernelOutcome => ({ status: 'ok', metrics, ms: 1 });

function matrix(
  id: string,
  expected: 'factor' | 'reject',
  candidate: KernelOutcome,
  incumbent: KernelOutcome | null = null,
): MatrixReport {
  const { passed, failures } = judgeMatrix(
    'lu-partial-pivoting',
    expected,
    candidate,
    defaultAcceptancePolicy,
  );
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
    expect(
      judgeMatrix('lu-partial-pivoting', 'factor', ok({ factorRatio: 29 }), defaultAcceptancePolicy)
        .passed,
    ).toBe(true);
    const bad = judgeMatrix(
      'lu-partial-pivoting',
      'factor',
      ok({ factorRatio: 31 }),
      defaultAcceptancePolicy,
    );
    expect(bad.passed).toBe(false);
    expect(bad.failures[0]).toBe('factor ratio 31 exceeds 30');
  });

  it('needs a throw on a must-reject matrix and explains what happened instead', () => {
    expect(
      judgeMatrix(
        'cholesky',
        'reject',
        { status: 'threw', message: 'not SPD', metrics: {}, ms: 1 },
        defaultAcceptancePolicy,
      ).passed,
    ).toBe(true);
    const silent = judgeMatrix(
      'cholesky',
      'reject',
      { status: 'non-finite', message: 'l[4] is NaN', metrics: {}, ms: 1 },
      defaultAcceptancePolicy,
    );
    expect(silent.passed).toBe(false);
    expect(silent.failures[0]).toContain('returned non-finite numbers: l[4] is NaN');
  });

  it('checks orthogonality for QR and the solve residual for back substitution', () => {
    expect(
      judgeMatrix(
        'householder-qr',
        'factor',
        ok({ factorRatio: 1, orthogonalityRatio: 500 }),
        defaultAcceptancePolicy,
      ).failures,
    ).toEqual(['orthogonality ratio 500 exceeds 30']);
    expect(
      judgeMatrix(
        'back-substitution',
        'factor',
        ok({ solveResidualRatio: 2 }),
        defaultAcceptancePolicy,
      ).passed,
    ).toBe(true);
    expect(
      judgeMatrix('back-substitution', 'factor', ok({}), defaultAcceptancePolicy).failures,
    ).toEqual(['solve residual ratio could not be computed']);
  });

  it('scales the factor-ratio threshold by the reference growth (Higham, ASNA Thm 9.5)', () => {
    const outcome = ok({ factorRatio: 5900 });
    expect(
      judgeMatrix('lu-partial-pivoting', 'factor', outcome, defaultAcceptancePolicy, 1).passed,
    ).toBe(false);
    const scaled = judgeMatrix(
      'lu-partial-pivoting',
      'factor',
      outcome,
      defaultAcceptancePolicy,
      7e6,
    );
    expect(scaled.passed).toBe(true);
    const beyond = judgeMatrix(
      'lu-partial-pivoting',
      'factor',
      ok({ factorRatio: 1e9 }),
      defaultAcceptancePolicy,
      7e6,
    );
    expect(beyond.failures).toEqual(['factor ratio 1.0e+9 exceeds 30 × reference growth 7.0e+6']);
  });

  it('treats a NaN or infinite ratio as a failure', () => {
    expect(
      judgeMatrix('lu-no-pivoting', 'factor', ok({ factorRatio: NaN }), defaultAcceptancePolicy)
        .passed,
    ).toBe(false);
    expect(
      judgeMatrix(
        'lu-no-pivoting',
        'factor',
        ok({ factorRatio: Infinity }),
        defaultAcceptancePolicy,
      ).passed,
    ).toBe(false);
  });
});

describe('evaluatePolicy', () => {
  it('passes a clean trial with every rule explained', () => {
    const result = evaluatePolicy(
      [
        matrix('a', 'factor', ok({ factorRatio: 0.5 }), ok({ factorRatio: 0.4 })),
        matrix('s', 'reject', { status: 'threw', metrics: {}, ms: 0 }),
      ],
      [timing(64, 1.01, 'no clear difference', [0.99, 1.03])],
      defaultAcceptancePolicy,
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
    const lossy = evaluatePolicy(
      [
        matrix(
          'hilbert-n8',
          'factor',
          ok({ factorRatio: 12, forwardError: 1e-6 }),
          ok({ factorRatio: 0.3, forwardError: 1e-8 }),
        ),
      ],
      [],
      defaultAcceptancePolicy,
    );
    expect(rule(lossy, 'versus-incumbent').passed).toBe(false);
    expect(rule(lossy, 'versus-incumbent').offenders).toEqual(['hilbert-n8']);
    expect(rule(lossy, 'versus-incumbent').reason).toContain('forwardError');
    // 1e-18 against 1e-17: both below u, so no loss is claimed.
    const tiny = evaluatePolicy(
      [
        matrix(
          'p',
          'factor',
          ok({ factorRatio: 0.9, normwiseBackwardError: 1e-17 }),
          ok({ factorRatio: 0.01, normwiseBackwardError: 1e-18 }),
        ),
      ],
      [],
      defaultAcceptancePolicy,
    );
    expect(rule(tiny, 'versus-incumbent').passed).toBe(true);
  });

  it('fails timing only when slower beyond the allowed slowdown', () => {
    const slow = evaluatePolicy(
      [],
      [timing(256, 1.3, 'slower', [1.25, 1.35])],
      defaultAcceptancePolicy,
    );
    expect(rule(slow, 'timing').passed).toBe(false);
    expect(rule(slow, 'timing').offenders).toEqual(['n=256']);
    const slight = evaluatePolicy(
      [],
      [timing(256, 1.04, 'slower', [1.035, 1.045])],
      defaultAcceptancePolicy,
    );
    expect(rule(slight, 'timing').passed).toBe(true);
  });

  it('fails rejections when a must-reject matrix returned numbers', () => {
    const result = evaluatePolicy(
      [matrix('singular-n2', 'reject', ok({ factorRatio: 0 }))],
      [],
      defaultAcceptancePolicy,
    );
    expect(result.passed).toBe(false);
    expect(rule(result, 'rejections').offenders).toEqual(['singular-n2']);
  });
});
