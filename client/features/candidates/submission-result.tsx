import { useEffect } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import { TrialProgressView } from '@client/features/trials/trial-progress.tsx';
import { useTrialEvents } from '@client/features/trials/use-trial-events.ts';
import type { Submission } from '@shared/api/candidates.ts';

/**
 * What happened to a submission: the type check's diagnostics at once, then the trial's live
 * progress, then the way to its report (followed by itself when the trial completes).
 */
export function SubmissionResult({
  submission,
  teamSlug,
}: {
  submission: Submission;
  teamSlug: string;
}) {
  const { candidate, revision, trial } = submission;
  const live = useTrialEvents(trial?.id ?? null);
  const navigate = useNavigate();
  const event = live.event;
  const status = event?.status ?? trial?.status ?? null;
  const completed = status === 'completed';

  useEffect(() => {
    if (trial && completed) {
      const timer = setTimeout(() => void navigate(paths.trial(teamSlug, trial.id)), 1200);
      return () => clearTimeout(timer);
    }
    return undefined;
  }, [completed, navigate, teamSlug, trial]);

  return (
    <section
      aria-labelledby="submission-heading"
      className="space-y-4"
      data-testid="submission-result"
    >
      <h2 id="submission-heading" className="text-lg font-semibold">
        {candidate.title}, revision {revision.number}
      </h2>
      <div>
        <h3 className="font-medium">Type check against the contract</h3>
        {revision.diagnostics.length === 0 ? (
          <p className="mt-1" data-testid="type-check-result">
            <SignalBadge signal="within">passed</SignalBadge>{' '}
            <span className="text-ink-soft">No type errors; the kernel goes on trial.</span>
          </p>
        ) : (
          <div data-testid="type-check-result">
            <p className="mt-1">
              <SignalBadge signal="beyond">
                {revision.diagnostics.length} error{revision.diagnostics.length === 1 ? '' : 's'}
              </SignalBadge>{' '}
              <span className="text-ink-soft">
                Fix them in the editor and submit a new revision; no trial runs until it checks.
              </span>
            </p>
            <ul className="mt-2 space-y-1 font-mono text-xs">
              {revision.diagnostics.map((d, i) => (
                <li key={i}>
                  {d.file === 'contract' ? 'contract ' : ''}line {d.line}:{d.column} {d.code} —{' '}
                  {d.message}
                </li>
              ))}
            </ul>
          </div>
        )}
      </div>
      {trial ? (
        <div>
          <h3 className="mb-2 font-medium">Trial</h3>
          <TrialProgressView
            status={status ?? trial.status}
            progress={event?.progress ?? trial.progress}
            message={event?.message ?? trial.message}
          />
          {live.lost ? (
            <p className="mt-1 text-sm text-ink">
              Live progress was interrupted; the report page shows the latest state.
            </p>
          ) : null}
          <p className="mt-3 flex flex-wrap gap-4 text-sm">
            <Link
              to={paths.trial(teamSlug, trial.id)}
              className="font-medium underline underline-offset-4"
            >
              {completed ? 'Open the trial report' : 'The trial report (fills in as it runs)'}
            </Link>
            <Link
              to={paths.candidate(teamSlug, candidate.id)}
              className="underline underline-offset-4"
            >
              The candidate’s review page
            </Link>
          </p>
        </div>
      ) : (
        <p className="text-sm">
          <Link to={paths.revise(teamSlug, candidate.id)} className="underline underline-offset-4">
            Submit a corrected revision
          </Link>
        </p>
      )}
    </section>
  );
}
