import { paths } from '@client/app/paths.ts';

/** Which of the team's sections a path belongs to: logbooks (the team's and a routine's), team admin, or routines. */
export function teamSection(
  pathname: string,
  teamSlug: string,
): 'routines' | 'logbook' | 'team' | null {
  const base = paths.team(teamSlug);
  if (pathname !== base && !pathname.startsWith(`${base}/`)) return null;
  if (
    pathname === paths.teamAdmin(teamSlug) ||
    pathname.startsWith(`${paths.teamAdmin(teamSlug)}/`)
  )
    return 'team';
  if (pathname === paths.logbook(teamSlug) || /\/routines\/\d+\/logbook\/?$/.test(pathname))
    return 'logbook';
  return 'routines';
}
