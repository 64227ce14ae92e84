import { z } from 'zod';

/** A numeric id in a route parameter (`/api/candidates/:id`). */
export const idSchema = z.coerce.number().int().positive().max(2_147_483_647);
export const idParamsSchema = z.object({ id: idSchema });

/** A team's or routine's slug: lowercase words joined by hyphens. */
export const slugSchema = z
  .string()
  .min(2)
  .max(48)
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use lowercase letters, digits and single hyphens');
