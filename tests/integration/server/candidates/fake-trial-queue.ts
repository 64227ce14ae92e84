import type { TrialQueue } from '@server/jobs/trial-queue.ts';

/** A trial queue that only remembers what was put on it, in order. */
export interface FakeTrialQueue extends TrialQueue {
  readonly enqueued: number[];
}

export function fakeTrialQueue(): FakeTrialQueue {
  const enqueued: number[] = [];
  return {
    enqueued,
    enqueueTrial: async (trialId) => {
      enqueued.push(trialId);
    },
    stop: async () => {},
  };
}
