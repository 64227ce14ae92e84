import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useLocation, useParams } from 'react-router-dom';
import { apiSend } from '@client/api/api-client.ts';
import { paths } from '@client/app/paths.ts';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { PageHeader } from '@client/components/page-header.tsx';
import { meQueries } from '@client/features/auth/me.queries.ts';
import { signInHref } from '@client/features/auth/sign-in-link.ts';
import { teamQueries } from '@client/features/teams/teams.queries.ts';
import { acceptedInvitationSchema, acceptInvitationSchema } from '@shared/api/invitations.ts';

/**
 * The page an invitation e-mail links to: a signed-in person accepts it and joins the team;
 * someone signed out signs in first and comes back here.
 */
export default function InvitationPage() {
  const { token = '' } = useParams();
  const location = useLocation();
  const queryClient = useQueryClient();
  const me = useQuery(meQueries.current());
  const accept = useMutation({
    mutationFn: () =>
      apiSend(
        'POST',
        '/api/invitations/accept',
        acceptInvitationSchema.parse({ token }),
        acceptedInvitationSchema,
      ),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: meQueries.all() });
      await queryClient.invalidateQueries({ queryKey: teamQueries.all() });
    },
  });
  const wellFormed = acceptInvitationSchema.safeParse({ token }).success;

  return (
    <div className="max-w-2xl">
      <PageHeader
        title="Invitation to a team"
        description="A maintainer invited you to review and submit kernels with their team."
      />
      {!wellFormed ? (
        <p role="alert" className="text-beyond">
          This invitation link is incomplete. Open the link from the e-mail once more, or ask the
          maintainer for a new invitation.
        </p>
      ) : me.isPending ? (
        <LoadingState label="Checking who is signed in…" />
      ) : me.isError ? (
        <ErrorState error={me.error} onRetry={() => void me.refetch()} />
      ) : me.data === null ? (
        <div className="space-y-3">
          <p>Sign in first; you come back to this page to accept.</p>
          <a
            className="inline-block rounded border border-ink px-4 py-2 font-medium"
            href={signInHref(location.pathname)}
          >
            Sign in with GitHub
          </a>
        </div>
      ) : accept.isSuccess ? (
        <div className="space-y-3" role="status">
          <p>{accept.data.message}</p>
          <Link className="font-medium underline" to={paths.routines(accept.data.team.slug)}>
            Go to the routines of {accept.data.team.name}
          </Link>
        </div>
      ) : (
        <div className="space-y-3">
          <p>
            You are signed in as <span className="font-mono">{me.data.user.login}</span>. Accepting
            adds you to the team with the role the invitation names.
          </p>
          {accept.isError ? <ErrorState error={accept.error} /> : null}
          <button
            type="button"
            className="rounded bg-ink px-4 py-2 font-medium text-paper disabled:opacity-60"
            disabled={accept.isPending}
            onClick={() => accept.mutate()}
          >
            {accept.isPending ? 'Accepting…' : 'Accept the invitation'}
          </button>
        </div>
      )}
    </div>
  );
}
