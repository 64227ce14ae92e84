import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { PageHeader } from '@client/components/page-header.tsx';
import type { Me } from '@shared/api/me.ts';

const roleWords = {
  author: 'You submit kernels.',
  reviewer: 'You submit kernels and review others’.',
  maintainer: 'You review, promote and run the team.',
} as const;

/** The signed-in start page: the teams I belong to, with my role in each. */
export function MyTeams({ me }: { me: Me }) {
  return (
    <div>
      <PageHeader
        eyebrow={`Signed in as ${me.user.login}`}
        title={`Welcome, ${me.user.name ?? me.user.login}`}
        description="Choose a team to see its routines, candidates and trials."
      />
      {me.teams.length === 0 ? (
        <EmptyState title="You are not in a team yet">
          Ask a maintainer for an invitation; its link adds you to the team.
        </EmptyState>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2" aria-label="My teams">
          {me.teams.map((team) => (
            <li key={team.id}>
              <Link
                to={paths.team(team.slug)}
                className="block rounded border border-rule bg-paper px-5 py-4 hover:border-ink/40 hover:bg-paper-deep"
              >
                <span className="block text-lg font-medium">{team.name}</span>
                <span className="mt-1 block text-sm text-ink-soft">
                  <span className="rounded border border-rule px-1.5 py-0.5 text-xs">
                    {team.role}
                  </span>{' '}
                  {roleWords[team.role]}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
