import { describe, expect, it } from 'vitest';
import { retryDelayMs } from '@server/mail/outbox.ts';

describe('retryDelayMs', () => {
  it('doubles from 5 seconds and stops at 10 minutes', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([5_000, 10_000, 20_000, 40_000]);
    expect(retryDelayMs(8)).toBe(600_000);
    expect(retryDelayMs(30)).toBe(600_000);
  });
});
