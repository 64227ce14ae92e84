import { describe, expect, it } from 'vitest';
import type { MatrixReport, TimingReport, TrialReport } from '@shared/trial-report.ts';
import type { MetricsSnapshot } from '@server/db/schema/promotions.ts';
import { driftFindings } from '@server/drift/drift-compare.ts';

function matrix(id: string, factorRatio: number, extra: Partial<MatrixReport> = {}): MatrixReport {
  return {
    id,
    family: 'uniform',
    m: 8,
    n: 8,
    condition: 40,
    conditionKind: 'estimate',
    expected: 'factor',
    referenceGrowth: 1,
    referenceTrusted: true,
    note: '',
    candidate: { status: 'ok', metrics: { factorRatio, forwardErrorOverBound: 0.1 }, ms: 0.1 },
    incumbent: null,
    passed: true,
    failures: [],
    ...extra,
  };
}

function timing(n: number, medianMs: number): TimingReport {
  return {
    n,
    rounds: 21,
    candidate: medianMs,
    incumbent: null,
    candidateDetail: { medianMs, q1Ms: medianMs, q3Ms: medianMs, gflops: 1 },
    incumbentDetail: null,
    ratio: null,
    ci95: null,
    pValue: null,
    verdict: null,
    flags: [],
  };
}

function report(matrices: MatrixReport[], times: TimingReport[]): TrialReport {
  return {
    routine: 'lu-partial-pivoting',
    status: 'completed',
    set: 'bay-frames',
    machine: {
      cpuModel: 'Invented CPU',
      cores: 2,
      totalMemoryBytes: 1e9,
      platform: 'linux',
      nodeVersion: '20',
      v8Version: '11',
      isolatedVmVersion: '5.0.4',
    },
    startedAt: '2026-01-01T00:00:00.000Z',
    phases: {
      compileMs: 1,
      matricesMs: 1,
      kernelMs: 1,
      referenceMs: 1,
      metricsMs: 1,
      timingMs: 1,
      totalMs: 6,
    },
    diagnostics: { candidate: [], incumbent: [] },
    matrices,
    timing: times,
    verdict: { passed: true, rules: [] },
  };
}

const snapshot: MetricsSnapshot = {
  worstFactorRatio: 2,
  worstForwardErrorOverBound: 0.1,
  timing: [{ n: 64, medianMs: 1, gflops: 0.2 }],
};

describe('driftFindings', () => {
  it('finds nothing when the re-run measures as at promotion', () => {
    expect(driftFindings(snapshot, report([matrix('a', 2.5)], [timing(64, 1.2)]))).toEqual([]);
  });

  it('reports a factor ratio more than 10 times worse, and not one just within', () => {
    expect(driftFindings(snapshot, report([matrix('a', 19.9)], []))).toEqual([]);
    const findings = driftFindings(snapshot, report([matrix('a', 21)], []));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toContain('factor ratio is now 21');
  });

  it('counts ratios below 1 as 1, so tiny ratios growing tenfold are no drift', () => {
    const tiny = { ...snapshot, worstFactorRatio: 0.01 };
    expect(driftFindings(tiny, report([matrix('a', 0.5)], []))).toEqual([]);
  });

  it('reports an infinite factor ratio and a matrix without a result', () => {
    const findings = driftFindings(
      snapshot,
      report(
        [
          matrix('a', Infinity),
          matrix('b', 1, {
            candidate: { status: 'timeout', metrics: {}, ms: 300 },
          }),
        ],
        [],
      ),
    );
    expect(findings.some((f) => f.includes('On b') && f.includes('timeout'))).toBe(true);
    expect(findings.some((f) => f.includes('factor ratio is now Infinity'))).toBe(true);
  });

  it('reports a median more than 1.25 times slower at a size, and not 1.2 times', () => {
    expect(driftFindings(snapshot, report([], [timing(64, 1.2)]))).toEqual([]);
    const findings = driftFindings(snapshot, report([], [timing(64, 1.3)]));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toContain('n = 64');
  });

  it('ignores sizes that the re-run did not time', () => {
    expect(driftFindings(snapshot, report([], [timing(128, 50)]))).toEqual([]);
  });
});
