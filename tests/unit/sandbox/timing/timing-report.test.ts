import { describe, expect, it } from 'vitest';
import { timingReportSchema } from '@shared/trial-report.ts';
import type { SizeTiming } from '@sandbox/timing/interleaved.ts';
import { toTimingReport } from '@sandbox/timing/timing-report.ts';

// Invented SizeTiming values.
const side = { minMs: 0.9, q1Ms: 1, medianMs: 1.1, q3Ms: 1.2, gflops: 2.5 };
const compared: SizeTiming = {
  n: 64,
  rounds: 31,
  candidate: side,
  incumbent: { ...side, medianMs: 1 },
  ratio: 1.1,
  ci95: [1.05, 1.15],
  pValue: 0.001,
  pValueAdjusted: 0.002,
  verdict: 'slower',
  blocks: 8,
  roundsPerBlock: [4, 4, 4, 4, 4, 4, 4, 3],
  blockRatios: [1.08, 1.12, 1.1, 1.09, 1.11, 1.1, 1.13, 1.07],
  betweenBlockSpread: 0.015,
  roundSpread: 0.04,
  callMs: 80.5,
  flags: [],
  failure: null,
};

describe('toTimingReport', () => {
  it('gives a report that the shared schema accepts, medians beside the details', () => {
    const report = timingReportSchema.parse(toTimingReport(compared));
    expect(report.candidate).toBe(1.1);
    expect(report.incumbent).toBe(1);
    expect(report.candidateDetail).toEqual({ medianMs: 1.1, q1Ms: 1, q3Ms: 1.2, gflops: 2.5 });
    expect(report).toMatchObject({ ratio: 1.1, ci95: [1.05, 1.15], verdict: 'slower' });
    expect(report).toMatchObject({
      blocks: 8,
      roundsPerBlock: compared.roundsPerBlock,
      blockRatios: compared.blockRatios,
      betweenBlockSpread: 0.015,
      roundSpread: 0.04,
      callMs: 80.5,
    });
    expect(report.message).toBeUndefined();
  });

  it('turns a failure into a message and keeps the flags', () => {
    const failed: SizeTiming = {
      ...compared,
      rounds: 0,
      candidate: null,
      ratio: null,
      ci95: null,
      pValue: null,
      pValueAdjusted: null,
      verdict: null,
      flags: ['candidate-failed'],
      failure: {
        kernel: 'candidate',
        phase: 'warm-up',
        status: 'timeout',
        message: 'over 2 s',
        block: 2,
      },
    };
    const report = timingReportSchema.parse(toTimingReport(failed));
    expect(report.message).toContain('in block 3');
    expect(report.candidate).toBeNull();
    expect(report.flags).toEqual(['candidate-failed']);
    expect(report.message).toContain('timeout');
    expect(report.message).toContain('over 2 s');
  });

  it('still accepts a report made before the block fields existed', () => {
    const report = toTimingReport(compared);
    const { blocks, roundsPerBlock, blockRatios, betweenBlockSpread, roundSpread, ...before } =
      report;
    expect([blocks, roundsPerBlock, blockRatios, betweenBlockSpread, roundSpread]).not.toContain(
      undefined,
    );
    expect(timingReportSchema.parse(before)).toEqual(before);
    expect(() => timingReportSchema.parse({ ...report, blocks: -1 })).toThrow();
  });
});
