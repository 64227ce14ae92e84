import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import { acceptancePolicySchema, type AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { RoutineDetail } from '@shared/api/routines.ts';
import { updatePolicy } from './team-admin.queries.ts';

type PolicyInput = z.input<typeof acceptancePolicySchema>;

const numberFields: {
  name: Exclude<keyof AcceptancePolicy, 'requireRejections'>;
  label: string;
  hint: string;
  step: string;
}[] = [
  {
    name: 'maxFactorRatio',
    label: 'Largest factor ratio',
    hint: 'every matrix that must factor stays at or below it',
    step: 'any',
  },
  {
    name: 'maxAccuracyLossFactor',
    label: 'Largest accuracy loss against the incumbent',
    hint: 'a factor ≥ 1 on any metric and matrix',
    step: 'any',
  },
  {
    name: 'allowedSlowdown',
    label: 'Allowed slowdown',
    hint: 'a fraction: 0.05 is 5 %',
    step: 'any',
  },
  {
    name: 'timingMargin',
    label: 'Timing margin',
    hint: 'a fraction below which no difference is called faster or slower',
    step: 'any',
  },
  { name: 'signOffsRequired', label: 'Sign-offs required', hint: '1 to 10', step: '1' },
];

/** The acceptance policy of one routine, edited by maintainers. */
export function PolicySection({ teamId }: { teamId: number }) {
  const routines = useQuery(routineQueries.list(teamId));
  const [chosen, setChosen] = useState<number | null>(null);
  const routineId = chosen ?? routines.data?.items[0]?.id ?? null;
  return (
    <Section title="Acceptance policy" id="policy">
      {routines.isPending ? (
        <LoadingState label="Loading the routines…" />
      ) : routines.isError ? (
        <ErrorState error={routines.error} onRetry={() => void routines.refetch()} />
      ) : routines.data.items.length === 0 || routineId === null ? (
        <EmptyState title="This team has no routines yet." />
      ) : (
        <>
          <label className="text-sm">
            <span className="mr-2 font-medium">Routine</span>
            <select
              value={routineId}
              onChange={(e) => setChosen(Number(e.target.value))}
              className="rounded border border-rule bg-white px-2 py-1"
            >
              {routines.data.items.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.title}
                </option>
              ))}
            </select>
          </label>
          <RoutinePolicy key={routineId} routineId={routineId} />
        </>
      )}
    </Section>
  );
}

function RoutinePolicy({ routineId }: { routineId: number }) {
  const routine = useQuery(routineQueries.detail(routineId));
  if (routine.isPending) return <LoadingState label="Loading the policy…" />;
  if (routine.isError) return <ErrorState error={routine.error} />;
  return <PolicyForm routine={routine.data} />;
}

function PolicyForm({ routine }: { routine: RoutineDetail }) {
  const queryClient = useQueryClient();
  const form = useForm<PolicyInput, unknown, AcceptancePolicy>({
    resolver: zodResolver(acceptancePolicySchema),
    defaultValues: routine.policy,
  });
  const saving = useMutation({
    mutationFn: (policy: AcceptancePolicy) => updatePolicy(routine.id, policy),
    onSuccess: async (updated) => {
      toast.success(`The policy of ${updated.title} is saved`);
      form.reset(updated.policy);
      await queryClient.invalidateQueries({ queryKey: ['routines'] });
    },
    onError: (error) => toast.error(`The policy was not saved: ${errorMessage(error)}`),
  });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      onSubmit={form.handleSubmit((v) => saving.mutate(v))}
      className="mt-4 grid max-w-3xl gap-3 sm:grid-cols-2"
      aria-label={`Acceptance policy of ${routine.title}`}
    >
      {numberFields.map((f) => {
        const id = `policy-${f.name}`;
        const message = errors[f.name]?.message;
        return (
          <div key={f.name} className="text-sm">
            <label htmlFor={id} className="block font-medium">
              {f.label}
            </label>
            <input
              id={id}
              type="number"
              step={f.step}
              aria-describedby={`${id}-hint`}
              aria-invalid={message ? true : undefined}
              className="w-40 rounded border border-rule bg-white px-2 py-1 font-mono"
              {...form.register(f.name, { valueAsNumber: true })}
            />
            <p id={`${id}-hint`} className="text-xs text-ink-soft">
              {f.hint}
            </p>
            {message ? <p className="text-xs text-beyond">✕ {message}</p> : null}
          </div>
        );
      })}
      <label className="flex items-center gap-2 text-sm sm:col-span-2">
        <input type="checkbox" {...form.register('requireRejections')} />
        Matrices that must be rejected must make the kernel throw
      </label>
      <div className="sm:col-span-2">
        <button
          type="submit"
          disabled={saving.isPending || !form.formState.isDirty}
          className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-60"
        >
          Save the policy
        </button>
      </div>
    </form>
  );
}
