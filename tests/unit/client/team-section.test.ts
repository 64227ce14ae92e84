import { describe, expect, it } from 'vitest';
import { paths } from '@client/app/paths.ts';
import { teamSection } from '@client/components/team-section.ts';

describe('teamSection (which main navigation link is current)', () => {
  const team = 'hallbrook-structures';
  it.each([
    [paths.team(team), 'routines'],
    [paths.routines(team), 'routines'],
    [paths.routine(team, 4), 'routines'],
    [paths.submit(team, 4), 'routines'],
    [paths.candidate(team, 9), 'routines'],
    [paths.trial(team, 31), 'routines'],
    [paths.promotions(team, 4), 'routines'],
    [paths.logbook(team), 'logbook'],
    [paths.routineLogbook(team, 4), 'logbook'],
    [paths.teamAdmin(team), 'team'],
  ] as const)('%s belongs to %s', (path, section) => {
    expect(teamSection(path, team)).toBe(section);
  });

  it('is null outside the team, including a team whose slug starts the same', () => {
    expect(teamSection('/', team)).toBeNull();
    expect(teamSection(paths.mailbox(), team)).toBeNull();
    expect(teamSection(paths.team(`${team}-2`), team)).toBeNull();
  });
});
