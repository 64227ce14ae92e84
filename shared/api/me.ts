import { z } from 'zod';
import { teamRoleSchema } from '@shared/roles.ts';

/** The signed-in person as `GET /api/me` describes them. */
export const meUserSchema = z.object({
  id: z.number().int().positive(),
  login: z.string(),
  name: z.string().nullable(),
  email: z.string().nullable(),
  /** Administers the whole instance. */
  isAdmin: z.boolean(),
});
export type MeUser = z.infer<typeof meUserSchema>;

/** A team the person belongs to, with their role in it. */
export const meTeamSchema = z.object({
  id: z.number().int().positive(),
  slug: z.string(),
  name: z.string(),
  role: teamRoleSchema,
});
export type MeTeam = z.infer<typeof meTeamSchema>;

/** `GET /api/me`. */
export const meSchema = z.object({
  user: meUserSchema,
  teams: z.array(meTeamSchema),
});
export type Me = z.infer<typeof meSchema>;
