import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';
import { idSchema } from '@shared/api/params.ts';
import { teamRoleSchema } from '@shared/roles.ts';

/** `/api/teams/:teamId/members/:userId`. */
export const memberParamsSchema = z.object({ teamId: idSchema, userId: idSchema });

/** A member of a team with their role. */
export const memberSchema = z.object({
  userId: z.number().int().positive(),
  login: z.string(),
  name: z.string().nullable(),
  role: teamRoleSchema,
  joinedAt: z.iso.datetime({ offset: true }),
});
export type Member = z.infer<typeof memberSchema>;

/** `GET /api/teams/:teamId/members`, by login. */
export const memberPageSchema = pageSchema(memberSchema);
export type MemberPage = z.infer<typeof memberPageSchema>;

/** `PATCH /api/teams/:teamId/members/:userId`. */
export const updateMemberSchema = z.strictObject({ role: teamRoleSchema });
export type UpdateMember = z.infer<typeof updateMemberSchema>;
