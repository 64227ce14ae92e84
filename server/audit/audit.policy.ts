import type { TeamRole } from '@shared/roles.ts';

/**
 * Who may read a team's audit log: its maintainers. Other members get 403; people outside the
 * team (admins included) get 404, as for everything inside a team.
 */
export const auditReaders: readonly TeamRole[] = ['maintainer'];
