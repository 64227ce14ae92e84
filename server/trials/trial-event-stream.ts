import { setTimeout as sleep } from 'node:timers/promises';
import type { Response } from 'express';
import { finalTrialStatuses, type TrialEvent } from '@shared/api/trials.ts';

export interface TrialEventSource {
  first: TrialEvent;
  /** Reads the trial again; null when it is gone. */
  next: () => Promise<TrialEvent | null>;
}

export interface StreamOptions {
  /** How often the trials row is read. */
  pollMs?: number;
  /** A comment line after this many quiet polls keeps proxies from closing the connection. */
  heartbeatEvery?: number;
}

const isFinal = (e: TrialEvent) => (finalTrialStatuses as readonly string[]).includes(e.status);

/**
 * Sends a trial's progress as server-sent events (HTML Living Standard, "Server-sent events"):
 * `progress` at once and whenever status or progress changes, read from the trials row every
 * `pollMs`; then `finished` when the trial is over, and the stream ends. It also ends when the
 * client goes away, and with an `error` event if the database cannot be read.
 */
export async function streamTrialEvents(
  res: Response,
  source: TrialEventSource,
  options: StreamOptions = {},
): Promise<void> {
  const { pollMs = 500, heartbeatEvery = 30 } = options;
  const gone = new AbortController();
  res.on('close', () => gone.abort());
  res.status(200).set({
    'Content-Type': 'text/event-stream; charset=utf-8',
    'Cache-Control': 'no-cache, no-transform',
    Connection: 'keep-alive',
    'X-Accel-Buffering': 'no',
  });
  res.flushHeaders();
  res.write('retry: 2000\n\n');
  const send = (event: string, data: unknown) =>
    res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`);

  let event: TrialEvent | null = source.first;
  let sent = '';
  let quiet = 0;
  while (!gone.signal.aborted) {
    if (event === null) {
      send('error', { message: 'The trial no longer exists.' });
      break;
    }
    if (isFinal(event)) {
      send('finished', event);
      break;
    }
    const data = JSON.stringify(event);
    if (data !== sent) {
      send('progress', event);
      sent = data;
      quiet = 0;
    } else if (++quiet >= heartbeatEvery) {
      res.write(': still running\n\n');
      quiet = 0;
    }
    try {
      await sleep(pollMs, undefined, { signal: gone.signal });
      event = await source.next();
    } catch {
      if (!gone.signal.aborted) send('error', { message: 'Progress could not be read.' });
      break;
    }
  }
  if (!res.writableEnded) res.end();
}
