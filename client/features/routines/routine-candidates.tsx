import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { candidateQueries } from '@client/features/candidates/candidates.queries.ts';
import { CandidateStateBadge } from '@client/features/candidates/state-badge.tsx';

/** The routine's candidates, most recently changed first, with their states. */
export function RoutineCandidates({
  routineId,
  teamSlug,
}: {
  routineId: number;
  teamSlug: string;
}) {
  const candidates = useQuery(candidateQueries.list(routineId));
  if (candidates.isPending) return <LoadingState label="Loading candidates…" />;
  if (candidates.isError) {
    return <ErrorState error={candidates.error} onRetry={() => void candidates.refetch()} />;
  }
  if (candidates.data.items.length === 0) {
    return <EmptyState title="No candidates yet">Submit the first one.</EmptyState>;
  }
  return (
    <table className="w-full border-collapse text-left text-sm">
      <caption className="sr-only">Candidates</caption>
      <thead className="border-b border-ink/30 text-ink-soft">
        <tr>
          <th scope="col" className="py-2 pr-3 font-medium">
            Candidate
          </th>
          <th scope="col" className="py-2 pr-3 font-medium">
            State
          </th>
          <th scope="col" className="py-2 pr-3 font-medium">
            Author
          </th>
          <th scope="col" className="py-2 pr-3 text-right font-medium">
            Revision
          </th>
          <th scope="col" className="py-2 font-medium">
            Changed
          </th>
        </tr>
      </thead>
      <tbody>
        {candidates.data.items.map((c) => (
          <tr key={c.id} className="border-b border-rule">
            <td className="py-2 pr-3">
              <Link to={paths.candidate(teamSlug, c.id)} className="underline underline-offset-4">
                {c.title}
              </Link>
            </td>
            <td className="py-2 pr-3">
              <CandidateStateBadge state={c.state} />
            </td>
            <td className="py-2 pr-3 font-mono text-xs">{c.author.login}</td>
            <td className="py-2 pr-3 text-right font-mono">{c.latestRevision}</td>
            <td className="py-2 text-xs text-ink-soft">{formatDateTime(c.updatedAt)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
