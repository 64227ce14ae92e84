/**
 * Runs trials one after another (timing needs a quiet core) and watches each one. pg-boss stops
 * waiting for a handler when the job expires, but cannot stop it; a trial still running then is
 * stuck, for example in an isolate that neither its call limit nor dispose() ends (a heap hog
 * that chains closures over large arrays, tests/hardening/isolate-hang.test.ts). Since every
 * later trial waits for it, `onStuck` is told, once, so that the process can end itself and a
 * fresh worker can take the queue (the job's retry, and in the end its dead letter, record it).
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
