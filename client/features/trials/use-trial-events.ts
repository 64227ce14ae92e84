import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { finalTrialStatuses, trialEventSchema, type TrialEvent } from '@shared/api/trials.ts';
import { trialQueries } from './trials.queries.ts';

export interface TrialEvents {
  event: TrialEvent | null;
  finished: boolean;
  /** The stream broke before the trial finished (the page falls back to the last state). */
  lost: boolean;
}

const isFinal = (status: TrialEvent['status']) =>
  (finalTrialStatuses as readonly string[]).includes(status);

/**
 * Follows a trial's live progress over the API's server-sent events (`/api/trials/:id/events`)
 * and refreshes the cached trial and candidates when it finishes. Pass null to follow nothing.
 */
export function useTrialEvents(trialId: number | null, enabled = true): TrialEvents {
  const queryClient = useQueryClient();
  const [state, setState] = useState<TrialEvents & { trialId: number | null }>({
    trialId: null,
    event: null,
    finished: false,
    lost: false,
  });

  useEffect(() => {
    if (trialId === null || !enabled) return;
    const source = new EventSource(`/api/trials/${trialId}/events`);
    let done = false;
    const read = (message: MessageEvent<string>) => {
      const parsed = trialEventSchema.safeParse(JSON.parse(message.data));
      return parsed.success ? parsed.data : null;
    };
    source.addEventListener('progress', (m) => {
      const event = read(m as MessageEvent<string>);
      if (event) setState({ trialId, event, finished: isFinal(event.status), lost: false });
    });
    source.addEventListener('finished', (m) => {
      const event = read(m as MessageEvent<string>);
      done = true;
      source.close();
      if (event) setState({ trialId, event, finished: true, lost: false });
      void queryClient.invalidateQueries({ queryKey: trialQueries.detail(trialId).queryKey });
      void queryClient.invalidateQueries({ queryKey: ['candidates'] });
      void queryClient.invalidateQueries({ queryKey: ['revisions'] });
      void queryClient.invalidateQueries({ queryKey: ['routines'] });
    });
    source.onerror = () => {
      // The server closes the stream after `finished`; anything else is a lost connection,
      // which EventSource retries by itself while the state is CONNECTING.
      if (!done && source.readyState === EventSource.CLOSED) {
        setState((s) => ({ ...s, trialId, lost: true }));
      }
    };
    return () => source.close();
  }, [trialId, enabled, queryClient]);

  // Answers for another trial (before this one's first event) do not count.
  if (state.trialId !== trialId) return { event: null, finished: false, lost: false };
  return { event: state.event, finished: state.finished, lost: state.lost };
}
