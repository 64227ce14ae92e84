import { useQuery } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import { candidateQueries } from '@client/features/candidates/candidates.queries.ts';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { finalTrialStatuses, type TrialDetail } from '@shared/api/trials.ts';
import { ErrorConditionPlot } from './error-condition-plot.tsx';
import { ExportLinks } from './export-links.tsx';
import { FailuresList } from './failures-list.tsx';
import { MachineCard } from './machine-card.tsx';
import { MatrixTable } from './matrix-table.tsx';
import { TimingPlot } from './timing-plot.tsx';
import { TimingTable } from './timing-table.tsx';
import { TrialProgressView } from './trial-progress.tsx';
import { trialQueries } from './trials.queries.ts';
import { useTrialEvents } from './use-trial-events.ts';
import { VerdictRules } from './verdict-rules.tsx';

function Section({
  id,
  title,
  children,
  note,
}: {
  id: string;
  title: string;
  children: ReactNode;
  note?: ReactNode;
}) {
  return (
    <section aria-labelledby={id} className="mb-12">
      <h2 id={id} className="text-xl font-semibold">
        {title}
      </h2>
      {note ? <p className="mt-1 max-w-prose text-sm text-ink-soft">{note}</p> : null}
      <div className="mt-4">{children}</div>
    </section>
  );
}

/** A trial's report at its permalink `/teams/:teamSlug/trials/:trialId`. */
export function TrialReportPage() {
  const { teamSlug } = useCurrentTeam();
  const trialId = Number(useParams().trialId);
  const trial = useQuery({ ...trialQueries.detail(trialId), enabled: trialId > 0 });
  if (trial.isPending) return <LoadingState label="Loading the trial report…" />;
  if (trial.isError) return <ErrorState error={trial.error} onRetry={() => void trial.refetch()} />;
  return <TrialReport trial={trial.data} teamSlug={teamSlug} />;
}

function TrialReport({ trial, teamSlug }: { trial: TrialDetail; teamSlug: string }) {
  const running = !(finalTrialStatuses as readonly string[]).includes(trial.status);
  const live = useTrialEvents(trial.id, running);
  const candidate = useQuery(candidateQueries.detail(trial.candidateId));
  const routine = useQuery(routineQueries.detail(trial.routineId));
  const revision = candidate.data?.revisions.find((r) => r.id === trial.revisionId);
  const threshold = routine.data?.policy.maxFactorRatio;
  const failedCount = trial.matrices.filter((m) => !m.passed).length;

  const verdictBadge =
    trial.status !== 'completed' ? (
      <SignalBadge signal={running ? 'near' : 'beyond'}>
        {trial.status.replace('-', ' ')}
      </SignalBadge>
    ) : trial.passed ? (
      <SignalBadge signal="within">passes the policy</SignalBadge>
    ) : (
      <SignalBadge signal="beyond">fails the policy</SignalBadge>
    );

  return (
    <div>
      <PageHeader
        eyebrow={
          <span className="flex flex-wrap gap-x-2">
            {routine.data ? (
              <Link
                to={paths.routine(teamSlug, trial.routineId)}
                className="underline underline-offset-4"
              >
                {routine.data.title}
              </Link>
            ) : null}
            <span aria-hidden="true">/</span>
            {candidate.data ? (
              <Link
                to={paths.candidate(teamSlug, trial.candidateId)}
                className="underline underline-offset-4"
              >
                {candidate.data.title}
              </Link>
            ) : (
              <span>candidate {trial.candidateId}</span>
            )}
            {revision ? <span>· revision {revision.number}</span> : null}
          </span>
        }
        title={
          <span className="flex flex-wrap items-center gap-3">
            Trial <span className="font-mono">#{trial.id}</span>
            <span className="text-base font-normal" data-testid="trial-verdict">
              {verdictBadge}
            </span>
          </span>
        }
        description={
          <span className="text-sm">
            {trial.purpose === 'drift-check' ? 'Drift check of the incumbent · ' : ''}
            Queued {formatDateTime(trial.createdAt)}
            {trial.finishedAt ? ` · finished ${formatDateTime(trial.finishedAt)}` : ''}
            {trial.incumbentRevisionId ? '' : ' · no incumbent to compare with'}
            {' · '}
            <a
              href={paths.trial(teamSlug, trial.id)}
              className="underline underline-offset-4"
              aria-label="Permalink to this trial report"
            >
              permalink
            </a>
          </span>
        }
        actions={<ExportLinks trial={trial} />}
      />

      {running || live.event ? (
        <div className="mb-8">
          <TrialProgressView
            status={live.event?.status ?? trial.status}
            progress={live.event?.progress ?? trial.progress}
            message={live.event?.message ?? trial.message}
          />
        </div>
      ) : trial.message ? (
        <p className="mb-8 rounded border border-rule px-4 py-3 text-sm">{trial.message}</p>
      ) : null}

      {trial.verdict ? (
        <Section
          id="verdict"
          title="Verdict, rule by rule"
          note="Each rule of the routine’s acceptance policy, what was checked and what was found."
        >
          <VerdictRules rules={trial.verdict.rules} />
        </Section>
      ) : null}

      {trial.matrices.length === 0 ? (
        running ? null : (
          <EmptyState title="No per-matrix results">
            The trial stopped before any matrix ran{trial.message ? `: ${trial.message}` : '.'}
          </EmptyState>
        )
      ) : (
        <>
          <Section
            id="matrices"
            title={`Per matrix (${trial.matrices.length}, ${failedCount} failed)`}
            note="Factor ratio = ‖PA − LU‖ / (n·‖A‖·u), or the solve residual ratio for back substitution; forward error over κ·u near or below 1 is what a stable method gives."
          >
            <MatrixTable matrices={trial.matrices} threshold={threshold} />
          </Section>
          <div className="grid gap-x-10 xl:grid-cols-2">
            <Section
              id="error-condition"
              title="Forward error against condition"
              note="Log–log; filled marks are the candidate, open diamonds the incumbent; the dashed line is κ·u."
            >
              <ErrorConditionPlot matrices={trial.matrices} />
            </Section>
            <Section
              id="timing-plot"
              title="Timing against the incumbent"
              note="Time ratio per size with its 95 % interval; below 1.0× the candidate is faster."
            >
              <TimingPlot timing={trial.timing} />
            </Section>
          </div>
        </>
      )}

      {trial.timing.length > 0 ? (
        <Section id="timing" title="Timing per size">
          <TimingTable timing={trial.timing} />
        </Section>
      ) : null}

      {trial.matrices.length > 0 ? (
        <Section id="failures" title="Failures">
          <FailuresList matrices={trial.matrices} />
        </Section>
      ) : null}

      <Section id="machine" title="Machine">
        <MachineCard machine={trial.machine} phases={trial.phases} />
      </Section>
    </div>
  );
}
