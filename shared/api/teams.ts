import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';
import { idSchema, slugSchema } from '@shared/api/params.ts';
import { teamRoleSchema } from '@shared/roles.ts';

/** `:teamId` in `/api/teams/:teamId/...`. */
export const teamParamsSchema = z.object({ teamId: idSchema });

/**
 * A login, as people know each other here. GitHub's own logins use letters, digits and hyphens;
 * the local fake provider (and the demo people, such as `priya.venkat`) also use dots and
 * underscores, so those are accepted too.
 */
export const loginSchema = z
  .string()
  .trim()
  .min(1)
  .max(100)
  .regex(/^[A-Za-z0-9](?:[A-Za-z0-9._-]*[A-Za-z0-9])?$/, 'not a valid login');

/**
 * `POST /api/teams` (admin). The admin becomes the team's maintainer unless `maintainerLogin`
 * names someone else who has signed in before.
 */
export const createTeamSchema = z.strictObject({
  name: z.string().trim().min(1, 'give the team a name').max(100),
  slug: slugSchema,
  maintainerLogin: loginSchema.optional(),
});
export type CreateTeam = z.infer<typeof createTeamSchema>;

/** A team as listed; `myRole` is null for an admin who is not a member. */
export const teamSummarySchema = z.object({
  id: z.number().int().positive(),
  slug: z.string(),
  name: z.string(),
  myRole: teamRoleSchema.nullable(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type TeamSummary = z.infer<typeof teamSummarySchema>;

/** `GET /api/teams`: the caller's teams (an admin's: every team), by name. */
export const teamPageSchema = pageSchema(teamSummarySchema);
export type TeamPage = z.infer<typeof teamPageSchema>;

/** `GET /api/teams/:teamId`. */
export const teamDetailSchema = teamSummarySchema.extend({
  counts: z.object({
    members: z.number().int().min(0),
    maintainers: z.number().int().min(0),
    routines: z.number().int().min(0),
    matrixSets: z.number().int().min(0),
    uploads: z.number().int().min(0),
    pendingInvitations: z.number().int().min(0),
  }),
});
export type TeamDetail = z.infer<typeof teamDetailSchema>;
