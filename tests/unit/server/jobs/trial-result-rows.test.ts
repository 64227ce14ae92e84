import { describe, expect, it } from 'vitest';
import type { TrialReport } from '@shared/trial-report.ts';
import { forJsonb, matrixResultRows, timingResultRows } from '@server/jobs/trial-result-rows.ts';

describe('forJsonb', () => {
  it('turns non-finite numbers into the strings the trials API revives, and keeps the rest', () => {
    expect(
      forJsonb({ factorRatio: Infinity, growthFactor: NaN, low: -Infinity, ok: 0.5, note: 'x' }),
    ).toEqual({
      factorRatio: 'Infinity',
      growthFactor: 'NaN',
      low: '-Infinity',
      ok: 0.5,
      note: 'x',
    });
  });
});

describe('timingResultRows', () => {
  it('splits the confidence interval into its columns and keeps the whole report as detail', () => {
    const timing: TrialReport['timing'][number] = {
      n: 64,
      rounds: 21,
      candidate: 0.48,
      incumbent: 0.55,
      candidateDetail: null,
      incumbentDetail: null,
      ratio: 0.87,
      ci95: [0.84, 0.9],
      pValue: 0.001,
      verdict: 'faster',
      flags: [],
    };
    const [row] = timingResultRows(7, { timing: [timing] } as unknown as TrialReport);
    expect(row).toMatchObject({
      trialId: 7,
      n: 64,
      candidateMs: 0.48,
      incumbentMs: 0.55,
      ciLow: 0.84,
      ciHigh: 0.9,
      verdict: 'faster',
    });
    expect(row!.detail).toEqual(timing);
  });
});

describe('matrixResultRows', () => {
  it("keeps the reference solver's growth factor of each matrix in its own column", () => {
    const matrix = (id: string, referenceGrowth: number | null) => ({
      id,
      family: 'uniform',
      m: 4,
      n: 4,
      condition: 12,
      conditionKind: 'estimate',
      referenceGrowth,
      expected: 'factor',
      referenceTrusted: true,
      note: '',
      candidate: { status: 'ok', metrics: { factorRatio: 0.3 }, ms: 0.01 },
      incumbent: null,
      passed: true,
      failures: [],
    });
    const report = { matrices: [matrix('a', 1.5), matrix('b', null)] } as unknown as TrialReport;
    const rows = matrixResultRows(3, report);
    expect(rows.map((r) => [r.matrixId, r.position, r.referenceGrowth])).toEqual([
      ['a', 0, 1.5],
      ['b', 1, null],
    ]);
  });
});
