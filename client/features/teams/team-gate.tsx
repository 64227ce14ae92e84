import { Link, Outlet, useLocation } from 'react-router-dom';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { signInHref } from '@client/features/auth/sign-in-link.ts';
import { useCurrentTeam } from './use-current-team.ts';

/**
 * Wraps every `/teams/:teamSlug/...` page: asks a signed-out visitor to sign in and tells a
 * visitor outside the team that there is nothing here (as the API does: 404, not 403).
 */
export function TeamGate() {
  const { team, user, isPending, error, teamSlug } = useCurrentTeam();
  const { pathname } = useLocation();
  if (isPending) return <LoadingState />;
  if (error) return <ErrorState error={error} />;
  if (!user) {
    return (
      <EmptyState title="Please sign in">
        <a href={signInHref(pathname)} className="underline">
          Sign in with GitHub
        </a>{' '}
        to see this team’s pages.
      </EmptyState>
    );
  }
  if (!team) {
    return (
      <EmptyState title="No team here">
        There is no team <code className="font-mono">{teamSlug}</code> among yours.{' '}
        <Link to="/" className="underline">
          Your teams
        </Link>
      </EmptyState>
    );
  }
  return <Outlet />;
}
