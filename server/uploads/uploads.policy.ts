import type { TeamRole } from '@shared/roles.ts';

/**
 * Maintainers upload Matrix Market files (and preview them); every member may list them and
 * read their content. People outside the team, admins included, get 404.
 */
export const uploaders: readonly TeamRole[] = ['maintainer'];
