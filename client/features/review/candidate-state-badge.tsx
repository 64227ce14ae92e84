import { SignalBadge } from '@client/components/signal-badge.tsx';
import type { Signal } from '@client/components/signal.ts';
import { candidateStateLabels, type CandidateState } from '@shared/states.ts';

const stateSignal: Record<CandidateState, Signal> = {
  drafting: 'neutral',
  'on-trial': 'near',
  'in-review': 'near',
  cleared: 'within',
  promoted: 'within',
  returned: 'beyond',
  withdrawn: 'neutral',
  'trial-failed': 'beyond',
};

/** A candidate's state in words, with its signal colour and symbol. */
export function CandidateStateBadge({ state }: { state: CandidateState }) {
  return <SignalBadge signal={stateSignal[state]}>{candidateStateLabels[state]}</SignalBadge>;
}
