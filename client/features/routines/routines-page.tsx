import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatMs, formatRatio } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { routineTitles } from '@shared/routines.ts';
import { OpenCandidates } from './open-candidates.tsx';
import { routineQueries } from './routines.queries.ts';

/** A team's routines with the incumbent's headline figures and the candidates in play. */
export function RoutinesPage() {
  const { team } = useCurrentTeam();
  const teamId = team?.id ?? 0;
  const routines = useQuery({ ...routineQueries.list(teamId), enabled: teamId > 0 });
  if (!team) return null;
  return (
    <div>
      <PageHeader
        eyebrow={team.name}
        title="Routines"
        description="Each routine has one incumbent in production; candidates compete to replace it."
      />
      {routines.isPending ? (
        <LoadingState label="Loading routines…" />
      ) : routines.isError ? (
        <ErrorState error={routines.error} onRetry={() => void routines.refetch()} />
      ) : routines.data.items.length === 0 ? (
        <EmptyState title="No routines yet">
          A maintainer sets up a routine with its contract, matrix set and acceptance policy.
        </EmptyState>
      ) : (
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Routines of {team.name}</caption>
          <thead className="border-b border-ink/30 text-sm text-ink-soft">
            <tr>
              <th scope="col" className="py-2 pr-4 font-medium">
                Routine
              </th>
              <th scope="col" className="py-2 pr-4 font-medium">
                Incumbent
              </th>
              <th scope="col" className="py-2 pr-4 text-right font-medium">
                Worst factor ratio
              </th>
              <th scope="col" className="py-2 pr-4 text-right font-medium">
                Time at largest size
              </th>
              <th scope="col" className="py-2 font-medium">
                Candidates
              </th>
            </tr>
          </thead>
          <tbody>
            {routines.data.items.map((r) => (
              <tr key={r.id} className="border-b border-rule align-top">
                <td className="py-3 pr-4">
                  <Link
                    to={paths.routine(team.slug, r.id)}
                    className="font-medium underline decoration-rule underline-offset-4 hover:decoration-ink"
                  >
                    {r.title}
                  </Link>
                  <span className="block text-xs text-ink-soft">
                    {routineTitles[r.contract]} · <span className="font-mono">{r.slug}</span>
                  </span>
                </td>
                <td className="py-3 pr-4 text-sm">
                  {r.incumbent ? (
                    <>
                      <Link
                        to={paths.candidate(team.slug, r.incumbent.candidateId)}
                        className="underline decoration-rule underline-offset-4 hover:decoration-ink"
                      >
                        {r.incumbent.candidateTitle}
                      </Link>
                      <span className="block text-xs text-ink-soft">
                        revision {r.incumbent.revisionNumber}
                      </span>
                    </>
                  ) : r.incumbentRevisionId ? (
                    'in production'
                  ) : (
                    <span className="text-ink-soft">none yet</span>
                  )}
                </td>
                <td className="py-3 pr-4 text-right font-mono">
                  {formatRatio(r.headline?.worstFactorRatio)}
                </td>
                <td className="py-3 pr-4 text-right font-mono">
                  {r.headline?.timingMedianMs != null ? (
                    <>
                      {formatMs(r.headline.timingMedianMs)}
                      <span className="block text-xs text-ink-soft">n = {r.headline.timingN}</span>
                    </>
                  ) : (
                    '—'
                  )}
                </td>
                <td className="py-3 text-sm">
                  <OpenCandidates counts={r.openCandidates} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
