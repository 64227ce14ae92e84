import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { TrialProgressRecord } from '@server/db/schema/trials.ts';
import { createProgressWriter } from '@server/jobs/progress-writer.ts';

const at = (done: number): TrialProgressRecord => ({ phase: 'accuracy', done, total: 10 });

describe('createProgressWriter', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('writes the first update at once and then the newest at most once per interval', async () => {
    const written: number[] = [];
    const writer = createProgressWriter(
      async (p) => void written.push(p.done),
      () => {},
      250,
    );
    writer.update(at(0));
    writer.update(at(1));
    writer.update(at(2));
    await vi.advanceTimersByTimeAsync(0);
    expect(written).toEqual([0]);
    await vi.advanceTimersByTimeAsync(250);
    expect(written).toEqual([0, 2]);
    writer.update(at(3));
    await vi.advanceTimersByTimeAsync(100);
    expect(written).toEqual([0, 2]);
    await vi.advanceTimersByTimeAsync(150);
    expect(written).toEqual([0, 2, 3]);
    await writer.close();
  });

  it('writes nothing after close and reports a failed write without throwing', async () => {
    const errors: unknown[] = [];
    const writer = createProgressWriter(
      async () => {
        throw new Error('connection lost');
      },
      (err) => errors.push(err),
      250,
    );
    writer.update(at(0));
    writer.update(at(1));
    await writer.close();
    await vi.advanceTimersByTimeAsync(1000);
    expect(errors).toHaveLength(1);
  });
});
