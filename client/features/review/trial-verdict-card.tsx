import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import type { CandidateDetail } from '@shared/api/candidates.ts';

/** The latest trial's verdict with a link to its report, and how far the candidate is from cleared. */
export function TrialVerdictCard({
  candidate,
  teamSlug,
}: {
  candidate: CandidateDetail;
  teamSlug: string;
}) {
  const trial = candidate.latestTrial;
  const latest = candidate.revisions.at(-1);
  const { clearance } = candidate;
  return (
    <section aria-labelledby="trial-title" className="rounded border border-rule p-4">
      <h2 id="trial-title" className="font-semibold">
        Latest trial{latest ? ` (revision ${latest.number})` : ''}
      </h2>
      {trial === null ? (
        <p className="mt-2 text-sm">
          <SignalBadge signal="beyond">did not run</SignalBadge>{' '}
          {latest && latest.errorCount > 0
            ? `Revision ${latest.number} has ${latest.errorCount} type ${latest.errorCount === 1 ? 'error' : 'errors'} against the contract, so no trial was run.`
            : 'No trial has run for the latest revision.'}
        </p>
      ) : (
        <div className="mt-2 space-y-2 text-sm">
          <p className="flex flex-wrap items-center gap-2">
            {trial.status === 'completed' ? (
              trial.passed ? (
                <SignalBadge signal="within">passed the policy</SignalBadge>
              ) : (
                <SignalBadge signal="beyond">failed the policy</SignalBadge>
              )
            ) : trial.status === 'queued' || trial.status === 'running' ? (
              <SignalBadge signal="near">
                {trial.status === 'queued'
                  ? 'queued'
                  : `running: ${trial.progress.phase} ${trial.progress.done}/${trial.progress.total}`}
              </SignalBadge>
            ) : (
              <SignalBadge signal="beyond">
                {trial.status === 'errored' ? 'errored' : 'trial failed'}
              </SignalBadge>
            )}
            <Link to={paths.trial(teamSlug, trial.id)} className="font-medium underline">
              Read the report of trial #{trial.id}
            </Link>
          </p>
          {trial.message ? <p className="text-ink-soft">{trial.message}</p> : null}
          <p className="text-xs text-ink-soft">
            {trial.finishedAt
              ? `finished ${formatDateTime(trial.finishedAt)}`
              : `queued ${formatDateTime(trial.createdAt)}`}
          </p>
        </div>
      )}
      <div className="mt-4 border-t border-rule pt-3 text-sm">
        <p>
          Sign-offs on the latest revision:{' '}
          <span className="figures font-mono">
            {clearance.signOffs} of {clearance.signOffsRequired}
          </span>
        </p>
        {clearance.stillNeeded.length > 0 ? (
          <p className="mt-1 text-ink-soft">Still needed: {clearance.stillNeeded.join('; ')}.</p>
        ) : candidate.state === 'cleared' ? (
          <p className="mt-1 text-within">✓ Cleared: a maintainer may promote it.</p>
        ) : null}
      </div>
    </section>
  );
}
