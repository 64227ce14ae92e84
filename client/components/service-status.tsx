import { useQuery } from '@tanstack/react-query';
import { healthQueries } from '../api/health.queries.ts';

/** A quiet line saying whether the service and its database answer. */
export function ServiceStatus() {
  const { data, isPending, isError } = useQuery(healthQueries.status());
  if (isPending) return <span className="figures">checking service…</span>;
  if (isError || !data) {
    return <span className="text-beyond">✕ service unreachable</span>;
  }
  return (
    <span className="figures" data-testid="service-status">
      {data.db === 'up' ? (
        <span className="text-within">● database up</span>
      ) : (
        <span className="text-beyond">✕ database down</span>
      )}
      <span className="ml-3 font-mono">v{data.version}</span>
    </span>
  );
}
