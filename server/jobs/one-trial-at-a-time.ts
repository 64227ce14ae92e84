/**
 * Runs trials one after another (timing needs a quiet core) and watches each one. pg-boss stops
 * waiting for a handler when the job expires, but cannot stop it; a trial still running then is
 * stuck, and since every later trial waits for it, `onStuck` is told, once, so that the process
 * can end itself and a fresh worker can take the queue (the job's retry, and in the end its dead
 * letter, record it). This is the last resort: the worker runs each trial in a trial process with
 * a deadline shorter than the job's expiry (sandbox/trial-process/), which kills a kernel that
 * no limit of its isolate stops (tests/hardening/isolate-hang.test.ts) and fails its trial.
 */
export interface WatchOptions {
  /** How long one trial may run before it counts as stuck, in ms. */
  stuckAfterMs: number;
  onStuck: (trialId: number) => void;
}

export function oneTrialAtATime<T>(
  run: (trialId: number) => Promise<T>,
  options: WatchOptions,
): (trialId: number) => Promise<T> {
  let chain: Promise<unknown> = Promise.resolve();
  return (trialId) => {
    const next = chain.then(() => {
      const timer = setTimeout(() => options.onStuck(trialId), options.stuckAfterMs);
      timer.unref();
      return run(trialId).finally(() => clearTimeout(timer));
    });
    chain = next.catch(() => {});
    return next;
  };
}
