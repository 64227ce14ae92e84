import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery } from '@tanstack/react-query';
import { Controller, useForm } from 'react-hook-form';
import { Link, useParams } from 'react-router-dom';
import type { z } from 'zod';
import { paths } from '@client/app/paths.ts';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { PageHeader } from '@client/components/page-header.tsx';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { createCandidateSchema } from '@shared/api/candidates.ts';
import { contractExports } from '@shared/contracts/contract-texts.ts';
import type { RoutineDetail } from '@shared/api/routines.ts';
import { KernelSourceField } from './kernel-source-field.tsx';
import { SubmissionResult } from './submission-result.tsx';
import { useSubmitCandidate } from './submit.mutations.ts';

type FormInput = z.input<typeof createCandidateSchema>;
type FormOutput = z.output<typeof createCandidateSchema>;

/** Submit a new candidate for a routine: title, description and the kernel's source. */
export function SubmitPage() {
  const { teamSlug } = useCurrentTeam();
  const routineId = Number(useParams().routineId);
  const routine = useQuery({ ...routineQueries.detail(routineId), enabled: routineId > 0 });
  if (routine.isPending) return <LoadingState label="Loading the routine…" />;
  if (routine.isError)
    return <ErrorState error={routine.error} onRetry={() => void routine.refetch()} />;
  return <SubmitForm routine={routine.data} teamSlug={teamSlug} />;
}

const fieldClass =
  'mt-1 w-full rounded border border-rule bg-paper px-3 py-2 focus:border-ink aria-[invalid=true]:border-beyond';

function SubmitForm({ routine, teamSlug }: { routine: RoutineDetail; teamSlug: string }) {
  const submit = useSubmitCandidate(routine.id);
  const form = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(createCandidateSchema),
    defaultValues: { title: '', description: '', source: routine.starterSource },
  });
  const { errors } = form.formState;

  return (
    <div>
      <PageHeader
        eyebrow={
          <Link to={paths.routine(teamSlug, routine.id)} className="underline underline-offset-4">
            {routine.title}
          </Link>
        }
        title="Submit a candidate"
        description="Your kernel is type-checked against the contract at once, then tried on the routine’s matrix set next to the incumbent."
      />
      {submit.data ? (
        <div className="mb-8">
          <SubmissionResult submission={submit.data} teamSlug={teamSlug} />
        </div>
      ) : null}
      <form
        noValidate
        onSubmit={form.handleSubmit((values) => submit.mutate(values))}
        className="space-y-5"
        aria-label="Submit a candidate"
      >
        <div className="grid gap-5 lg:grid-cols-[2fr_3fr]">
          <div>
            <label htmlFor="candidate-title" className="font-medium">
              Title
            </label>
            <input
              id="candidate-title"
              {...form.register('title')}
              aria-invalid={errors.title ? true : undefined}
              aria-describedby={errors.title ? 'candidate-title-error' : undefined}
              className={fieldClass}
              placeholder="Blocked right-looking LU, block size 32"
            />
            {errors.title ? (
              <p id="candidate-title-error" className="mt-1 text-sm text-beyond" role="alert">
                <span aria-hidden="true">✕ </span>
                {errors.title.message}
              </p>
            ) : null}
          </div>
          <div>
            <label htmlFor="candidate-description" className="font-medium">
              Description <span className="font-normal text-ink-soft">(optional)</span>
            </label>
            <textarea
              id="candidate-description"
              rows={3}
              {...form.register('description')}
              className={fieldClass}
              placeholder="What changed, and why it should be at least as accurate."
            />
            {errors.description ? (
              <p className="mt-1 text-sm text-beyond" role="alert">
                {errors.description.message}
              </p>
            ) : null}
          </div>
        </div>
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
        <div className="flex items-center gap-4">
          <button
            type="submit"
            disabled={submit.isPending || submit.isSuccess}
            className="rounded border border-ink bg-ink px-5 py-2 font-medium text-paper hover:bg-ink-soft disabled:opacity-60"
          >
            {submit.isPending ? 'Submitting…' : 'Submit for trial'}
          </button>
          {submit.isSuccess ? (
            <span className="text-sm text-ink-soft">
              Submitted. Further changes go in as a{' '}
              <Link to={paths.revise(teamSlug, submit.data.candidate.id)} className="underline">
                new revision
              </Link>
              .
            </span>
          ) : null}
        </div>
        {submit.isError ? <ErrorState error={submit.error} /> : null}
      </form>
    </div>
  );
}
