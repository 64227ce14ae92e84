import { candidateStateLabels } from '@shared/states.ts';
import { openCandidateStates, type OpenCandidateCounts } from '@shared/api/routines.ts';

/** "3 open: 1 on trial, 2 in review" in a compact line. */
export function OpenCandidates({ counts }: { counts: OpenCandidateCounts }) {
  const parts = openCandidateStates.filter((s) => counts[s] > 0);
  const total = parts.reduce((sum, s) => sum + counts[s], 0);
  if (total === 0) return <span className="text-ink-soft">none open</span>;
  return (
    <span>
      <span className="figures font-mono font-medium">{total}</span> open
      <span className="block text-xs text-ink-soft">
        {parts.map((s) => `${counts[s]} ${candidateStateLabels[s]}`).join(', ')}
      </span>
    </span>
  );
}
