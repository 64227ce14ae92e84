import { describe, expect, it } from 'vitest';
import { ratioTicks } from '@client/features/trials/ratio-ticks.ts';

/**
 * Domains as TimingPlot builds them: [min(0.8, lowest bound) / 1.05, max(1.25, highest bound) ×
 * 1.05], from two equally fast kernels to a candidate stuck slow at 30×.
 */
const domains: [number, number][] = [
  [0.8 / 1.05, 1.25 * 1.05],
  [0.8 / 1.05, 1.4],
  [0.8 / 1.05, 1.5],
  [0.8 / 1.05, 2.1],
  [0.8 / 1.05, 3.3],
  [0.3, 1.3],
  [0.4, 1.9],
  [0.095, 1.37],
  [0.8 / 1.05, 31.5],
  [1e-3, 1e3],
];

describe('ratioTicks (the time-ratio axis of the trial report)', () => {
  it.each(domains)(
    'on [%f, %f] marks 1× and at least two more ratios inside the domain',
    (lo, hi) => {
      const ticks = ratioTicks(lo, hi);
      expect(ticks).toContain(1);
      expect(ticks.length).toBeGreaterThanOrEqual(3);
      for (const t of ticks) {
        expect(t).toBeGreaterThanOrEqual(lo);
        expect(t).toBeLessThanOrEqual(hi);
      }
    },
  );

  it.each(domains)('on [%f, %f] keeps neighbours an eighth of the log width apart', (lo, hi) => {
    // Our own layout rule: at the plot's narrowest inner width an eighth of it still holds a
    // label such as "0.75×".
    const ticks = ratioTicks(lo, hi);
    const minGap = Math.log10(hi / lo) / 8;
    for (let i = 1; i < ticks.length; i++) {
      expect(Math.log10(ticks[i]! / ticks[i - 1]!)).toBeGreaterThanOrEqual(minGap);
    }
  });

  it('steps by tenths near 1 when the intervals are narrow', () => {
    expect(ratioTicks(0.8 / 1.05, 1.25 * 1.05)).toEqual([0.8, 0.9, 1, 1.1, 1.2, 1.3]);
  });

  it('falls back to 1× alone on a domain a log scale cannot draw', () => {
    expect(ratioTicks(0, 2)).toEqual([1]);
    expect(ratioTicks(0.5, Infinity)).toEqual([1]);
    expect(ratioTicks(2, 1)).toEqual([1]);
  });
});
