import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatRatio } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { routineQueries } from '@client/features/routines/routines.queries.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { routineTitles } from '@shared/routines.ts';

/** The team's logbooks: one per routine. */
export default function TeamLogbookPage() {
  const { teamSlug, team, isPending: teamPending } = useCurrentTeam();
  const routines = useQuery({ ...routineQueries.list(team?.id ?? 0), enabled: team !== undefined });
  if (teamPending || (team && routines.isPending))
    return <LoadingState label="Loading the routines…" />;
  if (!team) return <ErrorState error={new Error('You are not a member of this team.')} />;
  if (routines.isError) {
    return <ErrorState error={routines.error} onRetry={() => void routines.refetch()} />;
  }
  return (
    <div>
      <PageHeader
        title="Logbook"
        eyebrow={team.name}
        description="Pick a routine to see its history."
      />
      {routines.data?.items.length === 0 ? (
        <EmptyState title="This team has no routines yet." />
      ) : (
        <ul className="divide-y divide-rule rounded border border-rule">
          {routines.data?.items.map((r) => (
            <li key={r.id} className="flex items-center justify-between gap-4 p-3">
              <div>
                <Link to={paths.routineLogbook(teamSlug, r.id)} className="font-medium underline">
                  {r.title}
                </Link>
                <p className="text-sm text-ink-soft">{routineTitles[r.contract]}</p>
              </div>
              <p className="text-sm text-ink-soft">
                {r.headline ? (
                  <>
                    worst factor ratio{' '}
                    <span className="font-mono text-ink">
                      {formatRatio(r.headline.worstFactorRatio)}
                    </span>
                  </>
                ) : (
                  'no incumbent yet'
                )}
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
