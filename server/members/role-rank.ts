import { teamRoles, type TeamRole } from '@shared/roles.ts';

/** The higher of two team roles: author < reviewer < maintainer. */
export function higherRole(a: TeamRole, b: TeamRole): TeamRole {
  return teamRoles.indexOf(a) >= teamRoles.indexOf(b) ? a : b;
}
