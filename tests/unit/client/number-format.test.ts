import { describe, expect, it } from 'vitest';
import {
  formatError,
  formatGflops,
  formatInterval,
  formatMs,
  formatRatio,
  formatTimingRatio,
} from '@client/components/number-format.ts';

// The formats design.md asks for: errors as 3.1e-15, ratios as 0.84×, figures never "undefined".
describe('the number formats of the pages', () => {
  it('writes errors in scientific notation with two significant digits, and a dash when absent', () => {
    expect(formatError(3.14159e-15)).toBe('3.1e-15');
    expect(formatError(0)).toBe('0');
    expect(formatError(Infinity)).toBe('Infinity');
    expect(formatError(NaN)).toBe('NaN');
    expect(formatError(null)).toBe('—');
    expect(formatError(undefined)).toBe('—');
  });

  it('writes ratios to two significant digits, scientific only when tiny or huge', () => {
    expect(formatRatio(0.8391)).toBe('0.84');
    expect(formatRatio(31.4)).toBe('31');
    expect(formatRatio(6.04e7)).toBe('6.0e+7');
    expect(formatRatio(undefined)).toBe('—');
  });

  it('writes timing ratios and their intervals with the multiplication sign', () => {
    expect(formatTimingRatio(0.8412)).toBe('0.84×');
    expect(formatTimingRatio(null)).toBe('—');
    expect(formatInterval([0.81, 0.879])).toBe('[0.81×, 0.88×]');
    expect(formatInterval(null)).toBe('—');
  });

  it('writes speeds and durations with three significant digits', () => {
    expect(formatGflops(0.06678)).toBe('0.0668 GFLOP/s');
    expect(formatGflops(NaN)).toBe('—');
    expect(formatMs(0.040912)).toBe('0.0409 ms');
    expect(formatMs(1450)).toBe('1.45 s');
  });
});
