import { describe, expect, it } from 'vitest';
import type { TrialReport } from '@shared/trial-report.ts';
import { forJsonb, timingResultRows } from '@server/jobs/trial-result-rows.ts';

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
