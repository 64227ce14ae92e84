import { setTimeout as sleep } from 'node:timers/promises';
import {
  finalTrialStatuses,
  trialEventSchema,
  type TrialDetail,
  type TrialEvent,
} from '@shared/api/trials.ts';
import { ApiRequestError, type SubmitApiClient } from './submit-api-client.ts';
import { readServerSentEvents } from './server-sent-events.ts';

const isFinal = (status: string) => (finalTrialStatuses as readonly string[]).includes(status);

export interface FollowOptions {
  onProgress: (event: TrialEvent) => void;
  /** Between reads of the trial when the live stream is not available. */
  pollMs?: number;
}

/**
 * Follows a trial to its end and returns it with its full results. It listens to the trial's
 * live stream (`GET /api/trials/:id/events`); when the stream breaks off before `finished` (a
 * proxy that buffers, a server restart), it reads the trial every `pollMs` instead. Refusals
 * (401, 404) are not retried.
 */
export async function followTrial(
  client: SubmitApiClient,
  trialId: number,
  options: FollowOptions,
): Promise<TrialDetail> {
  const { onProgress, pollMs = 1000 } = options;
  let finished = false;
  const abort = new AbortController();
  try {
    const res = await client.trialEvents(trialId, abort.signal);
    if (res.body) {
      for await (const message of readServerSentEvents(res.body)) {
        if (message.event !== 'progress' && message.event !== 'finished') continue;
        const parsed = trialEventSchema.safeParse(JSON.parse(message.data));
        if (!parsed.success) continue;
        onProgress(parsed.data);
        if (message.event === 'finished' || isFinal(parsed.data.status)) {
          finished = true;
          break;
        }
      }
    }
  } catch (err) {
    if (err instanceof ApiRequestError && err.status < 500) throw err;
    // Otherwise the stream broke off; polling below carries on.
  } finally {
    abort.abort();
  }

  let last = '';
  for (;;) {
    const trial = await client.trial(trialId);
    if (finished || isFinal(trial.status)) return trial;
    const event: TrialEvent = {
      trialId,
      status: trial.status,
      progress: trial.progress,
      passed: trial.passed,
      message: trial.message,
    };
    const key = JSON.stringify(event);
    if (key !== last) onProgress(event);
    last = key;
    await sleep(pollMs);
  }
}
