import { zodResolver } from '@hookform/resolvers/zod';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { Controller, useForm } from 'react-hook-form';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { PageHeader } from '@client/components/page-header.tsx';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import type { CandidateDetail } from '@shared/api/candidates.ts';
import { createRevisionSchema, type CreateRevision } from '@shared/api/revisions.ts';
import type { RoutineDetail } from '@shared/api/routines.ts';
import { contractExports } from '@shared/contracts/contract-texts.ts';
import { candidateQueries, revisionQueries } from './candidates.queries.ts';
import { KernelSourceField } from './kernel-source-field.tsx';
import { CandidateStateBadge } from './state-badge.tsx';
import { SubmissionResult } from './submission-result.tsx';
import { useSubmitRevision } from './submit.mutations.ts';

/** A new revision of my candidate, starting from its latest source. */
export function RevisePage() {
  const { teamSlug } = useCurrentTeam();
  const candidateId = Number(useParams().candidateId);
  const candidate = useQuery({ ...candidateQueries.detail(candidateId), enabled: candidateId > 0 });
  const routineId = candidate.data?.routine.id ?? 0;
  const routine = useQuery({ ...routineQueries.detail(routineId), enabled: routineId > 0 });
  const latest = candidate.data?.revisions.at(-1);
  // After a submission the latest revision changes; keep the form (and its result) on screen
  // while the new one loads instead of unmounting it.
  const revision = useQuery({
    ...revisionQueries.detail(latest?.id ?? 0),
    enabled: !!latest,
    placeholderData: keepPreviousData,
  });

  const failed = candidate.error ?? routine.error ?? revision.error;
  if (failed) return <ErrorState error={failed} />;
  if (!candidate.data || !routine.data || !revision.data) {
    return <LoadingState label="Loading the candidate…" />;
  }
  return (
    <ReviseForm
      key={candidate.data.id}
      candidate={candidate.data}
      routine={routine.data}
      latestSource={revision.data.source}
      teamSlug={teamSlug}
    />
  );
}

function ReviseForm({
  candidate,
  routine,
  latestSource,
  teamSlug,
}: {
  candidate: CandidateDetail;
  routine: RoutineDetail;
  latestSource: string;
  teamSlug: string;
}) {
  const submit = useSubmitRevision(candidate.id);
  const form = useForm<CreateRevision>({
    resolver: zodResolver(createRevisionSchema),
    defaultValues: { source: latestSource },
  });
  const returned = [...candidate.reviews].reverse().find((r) => r.verdict === 'send-back');
  return (
    <div>
      <PageHeader
        eyebrow={
          <Link
            to={paths.candidate(teamSlug, candidate.id)}
            className="underline underline-offset-4"
          >
            {candidate.title}
          </Link>
        }
        title={`New revision of “${candidate.title}”`}
        description={
          <span>
            Now at revision {candidate.latestRevision}{' '}
            <CandidateStateBadge state={candidate.state} />
          </span>
        }
      />
      {!candidate.permissions.revise && !submit.data ? (
        <div className="mb-6">
          <EmptyState title="You cannot add a revision now">
            Only the candidate’s author adds revisions, and not while a trial runs.
          </EmptyState>
        </div>
      ) : null}
      {returned && candidate.state === 'returned' ? (
        <aside className="mb-6 rounded border border-near/40 bg-near/5 px-4 py-3 text-sm">
          <p className="font-medium">Sent back by {returned.reviewer.login}</p>
          <p className="mt-1 whitespace-pre-wrap text-ink-soft">{returned.body}</p>
        </aside>
      ) : null}
      {submit.data ? (
        <div className="mb-8">
          <SubmissionResult submission={submit.data} teamSlug={teamSlug} />
        </div>
      ) : null}
      <form
        noValidate
        aria-label="Submit a new revision"
        onSubmit={form.handleSubmit((values) => submit.mutate(values))}
        className="space-y-5"
      >
        <Controller
          control={form.control}
          name="source"
          render={({ field, fieldState }) => (
            <KernelSourceField
              value={field.value}
              onChange={field.onChange}
              contractText={routine.contractText}
              exportName={contractExports[routine.contract]}
              starterSource={routine.starterSource}
              serverDiagnostics={submit.data?.revision.diagnostics}
              error={fieldState.error?.message}
            />
          )}
        />
        <button
          type="submit"
          disabled={submit.isPending || !candidate.permissions.revise}
          className="rounded border border-ink bg-ink px-5 py-2 font-medium text-paper hover:bg-ink-soft disabled:opacity-60"
        >
          {submit.isPending ? 'Submitting…' : 'Submit the revision for trial'}
        </button>
        {submit.isError ? <ErrorState error={submit.error} /> : null}
      </form>
    </div>
  );
}
