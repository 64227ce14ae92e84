import { describe, expect, it } from 'vitest';
import { oneTrialAtATime } from '@server/jobs/one-trial-at-a-time.ts';

const never = () => new Promise<string>(() => {});
const after = (ms: number, value: string) =>
  new Promise<string>((resolve) => setTimeout(() => resolve(value), ms));

describe('one trial at a time, watched', () => {
  it('runs trials in order, never two at once', async () => {
    const log: string[] = [];
    let running = 0;
    const run = oneTrialAtATime(
      async (id) => {
        running++;
        log.push(`start ${id} (${running} running)`);
        await after(20, '');
        running--;
        log.push(`end ${id}`);
        return `trial ${id}`;
      },
      { stuckAfterMs: 10_000, onStuck: () => log.push('stuck') },
    );
    const results = await Promise.all([run(1), run(2), run(3)]);
    expect(results).toEqual(['trial 1', 'trial 2', 'trial 3']);
    expect(log).toEqual([
      'start 1 (1 running)',
      'end 1',
      'start 2 (1 running)',
      'end 2',
      'start 3 (1 running)',
      'end 3',
    ]);
  });

  it('reports a trial that runs past its deadline once, and only that one', async () => {
    const stuck: number[] = [];
    const run = oneTrialAtATime((id) => (id === 7 ? never() : after(5, `trial ${id}`)), {
      stuckAfterMs: 60,
      onStuck: (id) => stuck.push(id),
    });
    await expect(run(6)).resolves.toBe('trial 6');
    void run(7);
    await after(200, '');
    expect(stuck).toEqual([7]);
  });

  it('goes on after a trial that failed, and a failure is not a stuck trial', async () => {
    const stuck: number[] = [];
    const run = oneTrialAtATime(
      (id) => (id === 1 ? Promise.reject(new Error('harness fault')) : after(5, `trial ${id}`)),
      { stuckAfterMs: 50, onStuck: (id) => stuck.push(id) },
    );
    await expect(run(1)).rejects.toThrow('harness fault');
    await expect(run(2)).resolves.toBe('trial 2');
    await after(100, '');
    expect(stuck).toEqual([]);
  });
});
