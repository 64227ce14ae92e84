import type { TeamRole } from '@shared/roles.ts';

/**
 * Maintainers build, replace and delete matrix sets; every member may read them. People outside
 * the team, admins included, get 404.
 */
export const matrixSetEditors: readonly TeamRole[] = ['maintainer'];
