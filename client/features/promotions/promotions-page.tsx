import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { toast } from 'sonner';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import type { CandidateSummary } from '@shared/api/candidates.ts';
import type { Promotion, PromotionOutcome } from '@shared/api/promotions.ts';
import type { RoutineDetail } from '@shared/api/routines.ts';
import { ConfirmPromotionDialog } from './confirm-promotion-dialog.tsx';
import { PromotionRecord } from './promotion-record.tsx';
import { promoteCandidate, promotionQueries, reinstatePromotion } from './promotions.queries.ts';

type Pending =
  { kind: 'promote'; candidate: CandidateSummary } | { kind: 'reinstate'; promotion: Promotion };

/** For maintainers: a routine's cleared candidates to promote, and earlier incumbents to reinstate. */
export default function PromotionsPage() {
  const { routineId: rawId = '' } = useParams();
  const routineId = Number(rawId);
  const { teamSlug } = useCurrentTeam();
  const routine = useQuery({
    ...routineQueries.detail(routineId),
    enabled: Number.isInteger(routineId) && routineId > 0,
  });
  if (!Number.isInteger(routineId) || routineId <= 0) {
    return <ErrorState error={new Error(`“${rawId}” is not a routine number.`)} />;
  }
  if (routine.isPending) return <LoadingState label="Loading the routine…" />;
  if (routine.isError) {
    return <ErrorState error={routine.error} onRetry={() => void routine.refetch()} />;
  }
  return <Promotions routine={routine.data} teamSlug={teamSlug} />;
}

function Promotions({ routine, teamSlug }: { routine: RoutineDetail; teamSlug: string }) {
  const queryClient = useQueryClient();
  const isMaintainer = routine.myRole === 'maintainer';
  const cleared = useQuery({ ...promotionQueries.cleared(routine.id), enabled: isMaintainer });
  const logbook = useQuery(promotionQueries.logbook(routine.id));
  const [pending, setPending] = useState<Pending | null>(null);
  const [outcome, setOutcome] = useState<PromotionOutcome | null>(null);

  const mutation = useMutation({
    mutationFn: ({ action, note }: { action: Pending; note: string }) =>
      action.kind === 'promote'
        ? promoteCandidate(action.candidate.id, { note })
        : reinstatePromotion(routine.id, { promotionId: action.promotion.id, note }),
    onSuccess: async (result) => {
      setPending(null);
      setOutcome(result);
      toast.success(
        `${result.promotion.candidateTitle} revision ${result.promotion.revisionNumber} is the incumbent now`,
      );
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: ['candidates'] }),
        queryClient.invalidateQueries({ queryKey: ['routines'] }),
      ]);
    },
    onError: (error) => toast.error(`Nothing changed: ${errorMessage(error)}`),
  });

  const incumbentId = routine.incumbentRevisionId;
  const seen = new Set<number>();
  const earlier = [...(logbook.data?.promotions ?? [])].reverse().filter((p) => {
    if (p.revisionId === incumbentId || seen.has(p.revisionId)) return false;
    seen.add(p.revisionId);
    return true;
  });

  return (
    <div>
      <PageHeader
        eyebrow={
          <Link to={paths.routine(teamSlug, routine.id)} className="underline">
            {routine.title}
          </Link>
        }
        title="Promote or reinstate"
        description={
          routine.incumbent
            ? `The incumbent is ${routine.incumbent.candidateTitle}, revision ${routine.incumbent.revisionNumber}.`
            : 'This routine has no incumbent yet.'
        }
        actions={
          <Link to={paths.routineLogbook(teamSlug, routine.id)} className="text-sm underline">
            Logbook
          </Link>
        }
      />

      {outcome ? (
        <section
          aria-labelledby="outcome-title"
          className="mb-8 rounded border border-within/50 bg-within/5 p-4"
          data-testid="promotion-outcome"
        >
          <h2 id="outcome-title" className="font-semibold text-within">
            ✓ {outcome.promotion.kind === 'promote' ? 'Promoted' : 'Reinstated'}: the promotion
            record
          </h2>
          <div className="mt-3">
            <PromotionRecord promotion={outcome.promotion} teamSlug={teamSlug} />
          </div>
          <p className="mt-3 text-sm text-ink-soft">{outcome.caution}</p>
        </section>
      ) : null}

      {!isMaintainer ? (
        <p className="rounded border border-rule p-4 text-ink-soft" data-testid="not-maintainer">
          Only the team&apos;s maintainers promote and reinstate kernels. Your role here is{' '}
          {routine.myRole}.
        </p>
      ) : (
        <>
          <Section title="Cleared candidates" id="cleared">
            {cleared.isPending ? (
              <LoadingState label="Loading the cleared candidates…" />
            ) : cleared.isError ? (
              <ErrorState error={cleared.error} onRetry={() => void cleared.refetch()} />
            ) : cleared.data.items.length === 0 ? (
              <EmptyState title="No candidate is cleared for this routine.">
                A candidate is cleared when its latest trial passed and it has the sign-offs the
                policy asks for ({routine.policy.signOffsRequired}).
              </EmptyState>
            ) : (
              <ul className="divide-y divide-rule rounded border border-rule">
                {cleared.data.items.map((c) => (
                  <li key={c.id} className="flex flex-wrap items-center justify-between gap-3 p-3">
                    <div>
                      <Link to={paths.candidate(teamSlug, c.id)} className="font-medium underline">
                        {c.title}
                      </Link>
                      <p className="text-sm text-ink-soft">
                        revision {c.latestRevision} by {c.author.name ?? c.author.login} · cleared{' '}
                        {formatDateTime(c.updatedAt)}
                      </p>
                    </div>
                    <button
                      type="button"
                      onClick={() => setPending({ kind: 'promote', candidate: c })}
                      className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper"
                    >
                      Promote…
                    </button>
                  </li>
                ))}
              </ul>
            )}
          </Section>

          <Section title="Earlier incumbents" id="earlier">
            {logbook.isPending ? (
              <LoadingState label="Loading the promotions…" />
            ) : logbook.isError ? (
              <ErrorState error={logbook.error} onRetry={() => void logbook.refetch()} />
            ) : earlier.length === 0 ? (
              <EmptyState title="No earlier incumbent to reinstate." />
            ) : (
              <ul className="divide-y divide-rule rounded border border-rule">
                {earlier.map((p) => (
                  <li key={p.id} className="flex flex-wrap items-center justify-between gap-3 p-3">
                    <div>
                      <span className="font-medium">{p.candidateTitle}</span>{' '}
                      <span className="text-ink-soft">revision {p.revisionNumber}</span>
                      <p className="text-sm text-ink-soft">
                        {p.kind === 'promote' ? 'promoted' : 'reinstated'}{' '}
                        {formatDateTime(p.createdAt)} by {p.promotedBy.name ?? p.promotedBy.login}
                      </p>
                    </div>
                    <button
                      type="button"
                      onClick={() => setPending({ kind: 'reinstate', promotion: p })}
                      className="rounded border border-ink px-3 py-1.5 text-sm font-medium"
                    >
                      Reinstate…
                    </button>
                  </li>
                ))}
              </ul>
            )}
          </Section>
        </>
      )}

      <Section title="Promotion record" id="record">
        {logbook.isPending ? (
          <LoadingState label="Loading the record…" />
        ) : logbook.isError ? (
          <ErrorState error={logbook.error} />
        ) : logbook.data.promotions.length === 0 ? (
          <EmptyState title="Nothing has been promoted for this routine yet." />
        ) : (
          <ol className="space-y-4">
            {[...logbook.data.promotions].reverse().map((p) => (
              <li key={p.id} className="rounded border border-rule p-3">
                <PromotionRecord promotion={p} teamSlug={teamSlug} />
              </li>
            ))}
          </ol>
        )}
      </Section>

      {pending ? (
        <ConfirmPromotionDialog
          title={
            pending.kind === 'promote'
              ? `Promote “${pending.candidate.title}”`
              : `Reinstate “${pending.promotion.candidateTitle}”`
          }
          summary={
            pending.kind === 'promote'
              ? `Revision ${pending.candidate.latestRevision} becomes the incumbent of ${routine.title}; the team gets e-mail.`
              : `Revision ${pending.promotion.revisionNumber} becomes the incumbent of ${routine.title} again; the team gets e-mail.`
          }
          confirmLabel={pending.kind === 'promote' ? 'Promote' : 'Reinstate'}
          pending={mutation.isPending}
          onCancel={() => setPending(null)}
          onConfirm={(note) => mutation.mutate({ action: pending, note })}
        />
      ) : null}
    </div>
  );
}
