import { useQuery } from '@tanstack/react-query';
import { Link, NavLink, Outlet, useLocation } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import { meQueries } from '@client/features/auth/me.queries.ts';
import { signInHref } from '@client/features/auth/sign-in-link.ts';
import { useCurrentTeam } from '@client/features/teams/use-current-team.ts';
import { mailboxAvailableQuery } from './mailbox-available.ts';
import { ServiceStatus } from './service-status.tsx';
import { teamSection } from './team-section.ts';
import { TeamSwitcher } from './team-switcher.tsx';
import { UserMenu } from './user-menu.tsx';

const navClass = ({ isActive }: { isActive: boolean }) =>
  `border-b-2 px-1 pb-1 ${isActive ? 'border-ink font-medium text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`;

/** The frame of every page: product name, the person and their team, navigation, status. */
export function AppShell() {
  const me = useQuery(meQueries.current());
  const mailbox = useQuery(mailboxAvailableQuery());
  const { team, teamSlug } = useCurrentTeam();
  const { pathname } = useLocation();
  const navTeam = team?.slug ?? (teamSlug || me.data?.teams[0]?.slug);
  const section = navTeam ? teamSection(pathname, navTeam) : null;

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper focus:p-2"
      >
        Skip to content
      </a>
      <header className="border-b border-rule">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-6 gap-y-2 px-6 py-3">
          <div className="flex items-baseline gap-6">
            <Link
              to="/"
              className="text-xl font-semibold tracking-tight text-ink"
              data-testid="product-name"
            >
              Stablehand
            </Link>
            {me.data && navTeam ? (
              <nav aria-label="Main" className="flex gap-4 text-sm">
                <Link
                  to={paths.team(navTeam)}
                  className={navClass({ isActive: section === 'routines' })}
                  aria-current={section === 'routines' ? 'page' : undefined}
                >
                  Routines
                </Link>
                <Link
                  to={paths.logbook(navTeam)}
                  className={navClass({ isActive: section === 'logbook' })}
                  aria-current={section === 'logbook' ? 'page' : undefined}
                >
                  Logbook
                </Link>
                <Link
                  to={paths.teamAdmin(navTeam)}
                  className={navClass({ isActive: section === 'team' })}
                  aria-current={section === 'team' ? 'page' : undefined}
                >
                  Team
                </Link>
                {mailbox.data ? (
                  <NavLink to={paths.mailbox()} className={navClass}>
                    Mailbox
                  </NavLink>
                ) : null}
              </nav>
            ) : mailbox.data && !me.data && !me.isPending ? (
              <nav aria-label="Main" className="flex gap-4 text-sm">
                <NavLink to={paths.mailbox()} className={navClass}>
                  Mailbox
                </NavLink>
              </nav>
            ) : null}
          </div>
          <div className="flex flex-wrap items-center gap-5">
            {me.data ? (
              <>
                <TeamSwitcher teams={me.data.teams} current={team} />
                <UserMenu user={me.data.user} />
              </>
            ) : me.isPending ? null : (
              <a
                href={signInHref(pathname)}
                className="rounded border border-ink px-3 py-1 text-sm font-medium hover:bg-paper-deep"
              >
                Sign in with GitHub
              </a>
            )}
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-6 py-8">
        <Outlet />
      </main>
      <footer className="border-t border-rule">
        <div className="mx-auto flex max-w-6xl justify-between px-6 py-3 text-xs text-ink-soft">
          <span>Evidence for reviewers, not certification.</span>
          <ServiceStatus />
        </div>
      </footer>
    </div>
  );
}
