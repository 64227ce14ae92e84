import type { TeamRole } from '@shared/roles.ts';

/**
 * The demo team: the structural-analysis group of Hallbrook & Vey, the fictional engineering firm
 * of fake-github/demo-identities.ts. Every role is held: Inês maintains the routines and is the
 * instance's admin, Tomas and Mateo review (and write kernels too), Priya and Yara author.
 */
export const demoTeam = {
  slug: 'hallbrook-structures',
  name: 'Hallbrook & Vey — Structural Analysis',
  /** The first maintainer, named when the team is created. */
  maintainer: 'ines.okafor',
  admin: 'ines.okafor',
  members: [
    { login: 'tomas.lindqvist', role: 'reviewer' },
    { login: 'mateo.achterberg', role: 'reviewer' },
    { login: 'priya.venkat', role: 'author' },
    { login: 'yara.domsch', role: 'author' },
  ] satisfies { login: string; role: TeamRole }[],
} as const;
