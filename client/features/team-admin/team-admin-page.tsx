import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { PageHeader } from '@client/components/page-header.tsx';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { InvitationsSection } from './invitations-section.tsx';
import { MatrixSetsSection } from './matrix-sets-section.tsx';
import { MembersSection } from './members-section.tsx';
import { PolicySection } from './policy-section.tsx';
import { TokensSection } from './tokens-section.tsx';

const sections = [
  ['members', 'Members'],
  ['invitations', 'Invitations'],
  ['matrix-sets', 'Matrix sets'],
  ['policy', 'Acceptance policy'],
  ['tokens', 'API tokens'],
] as const;

/** Team admin: members and roles, invitations, matrix sets, policies, and one's API tokens. */
export default function TeamAdminPage() {
  const { team, user, isPending, error } = useCurrentTeam();
  if (isPending) return <LoadingState label="Loading the team…" />;
  if (error) return <ErrorState error={error} />;
  if (!team) return <ErrorState error={new Error('You are not a member of this team.')} />;
  const isMaintainer = team.role === 'maintainer' || user?.isAdmin === true;
  return (
    <div>
      <PageHeader
        eyebrow={team.name}
        title="Team"
        description={
          isMaintainer
            ? 'You are a maintainer: you manage members, invitations, matrix sets and policies.'
            : `Your role is ${team.role}. Maintainers manage members, invitations, matrix sets and policies; you see the members and your own API tokens.`
        }
      />
      <nav aria-label="Parts of this page" className="flex flex-wrap gap-4 text-sm">
        {sections
          .filter(([id]) => isMaintainer || id === 'members' || id === 'tokens')
          .map(([id, label]) => (
            <a key={id} href={`#${id}`} className="underline">
              {label}
            </a>
          ))}
      </nav>
      <MembersSection teamId={team.id} canManage={isMaintainer} myUserId={user?.id ?? null} />
      {isMaintainer ? (
        <>
          <InvitationsSection teamId={team.id} />
          <MatrixSetsSection teamId={team.id} />
          <PolicySection teamId={team.id} />
        </>
      ) : null}
      <TokensSection />
    </div>
  );
}
