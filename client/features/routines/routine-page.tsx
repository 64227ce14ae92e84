import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime, formatMs, formatRatio } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { routineTitles } from '@shared/routines.ts';
import { PolicyList } from './policy-list.tsx';
import { RoutineCandidates } from './routine-candidates.tsx';
import { routineQueries } from './routines.queries.ts';

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  const id = `section-${title.toLowerCase().replace(/\W+/g, '-')}`;
  return (
    <section aria-labelledby={id} className="mb-10">
      <h2 id={id} className="mb-3 text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** A routine: its contract, policy, matrix set, incumbent and candidates. */
export function RoutinePage() {
  const { teamSlug } = useCurrentTeam();
  const routineId = Number(useParams().routineId);
  const routine = useQuery({ ...routineQueries.detail(routineId), enabled: routineId > 0 });
  if (routine.isPending) return <LoadingState label="Loading the routine…" />;
  if (routine.isError) {
    return <ErrorState error={routine.error} onRetry={() => void routine.refetch()} />;
  }
  const r = routine.data;
  const incumbent = r.incumbent;
  return (
    <div>
      <PageHeader
        eyebrow={
          <Link to={paths.routines(teamSlug)} className="underline underline-offset-4">
            Routines
          </Link>
        }
        title={r.title}
        description={r.description || routineTitles[r.contract]}
        actions={
          <>
            <Link
              to={paths.routineLogbook(teamSlug, r.id)}
              className="rounded border border-ink/40 px-3 py-1.5 text-sm hover:bg-paper-deep"
            >
              Logbook
            </Link>
            {r.myRole === 'maintainer' ? (
              <Link
                to={paths.promotions(teamSlug, r.id)}
                className="rounded border border-ink/40 px-3 py-1.5 text-sm hover:bg-paper-deep"
              >
                Promotions
              </Link>
            ) : null}
            <Link
              to={paths.submit(teamSlug, r.id)}
              className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper hover:bg-ink-soft"
            >
              Submit a candidate
            </Link>
          </>
        }
      />
      <div className="grid gap-x-10 lg:grid-cols-[3fr_2fr]">
        <div className="min-w-0">
          <Section title="Incumbent">
            {incumbent ? (
              <div className="rounded border border-rule px-4 py-3">
                <p>
                  <span className="font-medium">{incumbent.candidateTitle}</span>, revision{' '}
                  <span className="font-mono">{incumbent.revisionNumber}</span>
                </p>
                {incumbent.promotion ? (
                  <>
                    <p className="mt-1 text-sm text-ink-soft">
                      Promoted by{' '}
                      <span className="font-mono">{incumbent.promotion.promotedBy.login}</span> on{' '}
                      {formatDateTime(incumbent.promotion.promotedAt)}
                    </p>
                    <dl className="mt-3 grid grid-cols-2 gap-2 text-sm">
                      <div>
                        <dt className="text-ink-soft">Worst factor ratio</dt>
                        <dd className="font-mono text-lg">
                          {formatRatio(incumbent.promotion.headline.worstFactorRatio)}
                        </dd>
                      </div>
                      <div>
                        <dt className="text-ink-soft">
                          Median time at n = {incumbent.promotion.headline.timingN ?? '—'}
                        </dt>
                        <dd className="font-mono text-lg">
                          {formatMs(incumbent.promotion.headline.timingMedianMs)}
                        </dd>
                      </div>
                    </dl>
                    <Link
                      to={paths.trial(teamSlug, incumbent.promotion.trialId)}
                      className="mt-3 inline-block text-sm underline underline-offset-4"
                    >
                      The trial it was promoted on
                    </Link>
                  </>
                ) : null}
              </div>
            ) : (
              <p className="text-ink-soft">
                No incumbent yet: the first candidate promoted becomes the one in production.
              </p>
            )}
          </Section>
          <Section title="Candidates">
            <RoutineCandidates routineId={r.id} teamSlug={teamSlug} />
          </Section>
          <Section title="Contract">
            <p className="mb-2 text-sm text-ink-soft">
              {routineTitles[r.contract]} · the declarations every kernel is type-checked against.
            </p>
            <pre
              tabIndex={0}
              aria-label="Contract declarations"
              className="max-h-96 overflow-auto rounded border border-rule bg-paper-deep p-4 font-mono text-xs leading-relaxed"
            >
              {r.contractText}
            </pre>
          </Section>
        </div>
        <div className="min-w-0">
          <Section title="Acceptance policy">
            <PolicyList policy={r.policy} />
          </Section>
          <Section title="Matrix set">
            <p className="font-medium">{r.matrixSet.name}</p>
            {r.matrixSet.description ? (
              <p className="mt-1 text-sm text-ink-soft">{r.matrixSet.description}</p>
            ) : null}
            <dl className="mt-3 grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Matrices</dt>
              <dd className="font-mono">{r.matrixSet.itemCount}</dd>
              <dt className="text-ink-soft">Timing sizes</dt>
              <dd className="font-mono">{r.matrixSet.timingSizes.join(', ')}</dd>
            </dl>
          </Section>
        </div>
      </div>
    </div>
  );
}
