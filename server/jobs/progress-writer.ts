import type { TrialProgressRecord } from '@server/db/schema/trials.ts';

export interface ProgressWriter {
  /** Records the latest progress; it is written at most once per interval. */
  update(progress: TrialProgressRecord): void;
  /** Drops what is not written yet and waits for the write in flight. */
  close(): Promise<void>;
}

/**
 * Throttles progress writes: the first update is written at once, later ones at most every
 * `intervalMs` (the newest wins), one write at a time, so a trial of many quick matrices does
 * not turn into a stream of UPDATEs. A failed write is reported and the trial goes on.
 */
export function createProgressWriter(
  write: (progress: TrialProgressRecord) => Promise<void>,
  onError: (err: unknown) => void,
  intervalMs = 250,
): ProgressWriter {
  let pending: TrialProgressRecord | null = null;
  let lastWrite = -Infinity;
  let timer: NodeJS.Timeout | undefined;
  let inFlight: Promise<void> = Promise.resolve();
  let closed = false;

  const writeNow = () => {
    timer = undefined;
    const progress = pending;
    pending = null;
    if (!progress || closed) return;
    lastWrite = Date.now();
    inFlight = inFlight.then(() => write(progress)).catch(onError);
  };

  return {
    update(progress) {
      if (closed) return;
      pending = progress;
      if (timer) return;
      const wait = lastWrite + intervalMs - Date.now();
      if (wait <= 0) writeNow();
      else timer = setTimeout(writeNow, wait);
    },
    async close() {
      closed = true;
      clearTimeout(timer);
      await inFlight;
    },
  };
}
