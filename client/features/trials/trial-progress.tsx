import { SignalBadge } from '@client/components/signal-badge.tsx';
import type { TrialProgress as Progress } from '@shared/api/trials.ts';
import type { TrialStatus } from '@shared/states.ts';

const phaseWords: Record<Progress['phase'], string> = {
  queued: 'waiting for a worker',
  compile: 'compiling the kernels',
  accuracy: 'running the matrices',
  timing: 'timing against the incumbent',
  verdict: 'judging by the policy',
  done: 'done',
};

/** Where a running trial is: the phase in words, and matrices done / total as a bar. */
export function TrialProgressView({
  status,
  progress,
  message,
}: {
  status: TrialStatus;
  progress: Progress;
  message?: string | null;
}) {
  const running = status === 'queued' || status === 'running';
  return (
    <div
      data-testid="trial-progress"
      data-status={status}
      className="rounded border border-rule px-4 py-3"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p aria-live="polite">
          <span className="font-medium">
            Trial {running ? 'in progress' : status.replace('-', ' ')}
          </span>
          {running ? <span className="text-ink-soft"> · {phaseWords[progress.phase]}</span> : null}
          {progress.label ? <span className="text-ink-soft"> · {progress.label}</span> : null}
        </p>
        {running ? (
          <SignalBadge signal="near">{status}</SignalBadge>
        ) : status === 'completed' ? (
          <SignalBadge signal="neutral">completed</SignalBadge>
        ) : (
          <SignalBadge signal="beyond">{status.replace('-', ' ')}</SignalBadge>
        )}
      </div>
      {running && progress.total > 0 ? (
        <div className="mt-2 flex items-center gap-3">
          <progress
            aria-label={`${progress.phase}: ${progress.done} of ${progress.total}`}
            max={progress.total}
            value={progress.done}
            className="h-2 flex-1 accent-[var(--color-within)]"
          />
          <span className="figures font-mono text-sm" data-testid="trial-progress-count">
            {progress.done} / {progress.total}
          </span>
        </div>
      ) : null}
      {message ? <p className="mt-2 text-sm text-ink-soft">{message}</p> : null}
    </div>
  );
}
