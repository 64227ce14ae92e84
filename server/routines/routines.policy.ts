import type { TeamRole } from '@shared/roles.ts';

/**
 * Maintainers create routines and change their title, description, acceptance policy and
 * matrix set; every member may read them. People outside the team, admins included, get 404.
 */
export const routineEditors: readonly TeamRole[] = ['maintainer'];
