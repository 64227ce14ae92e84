import { z } from 'zod';

/** A person's role within one team (product vocabulary). */
export const teamRoles = ['author', 'reviewer', 'maintainer'] as const;
export const teamRoleSchema = z.enum(teamRoles);
export type TeamRole = z.infer<typeof teamRoleSchema>;
