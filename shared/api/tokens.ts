import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';

/** An API token as listed: never the secret, only its first characters. */
export const apiTokenSchema = z.object({
  id: z.number().int().positive(),
  name: z.string(),
  /** The token's first characters, so a person can tell their tokens apart. */
  prefix: z.string(),
  createdAt: z.iso.datetime(),
  lastUsedAt: z.iso.datetime().nullable(),
  revokedAt: z.iso.datetime().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

/** `GET /api/tokens`: the caller's own tokens, newest first. */
export const apiTokenPageSchema = pageSchema(apiTokenSchema);
export type ApiTokenPage = z.infer<typeof apiTokenPageSchema>;

/** `POST /api/tokens`. */
export const createApiTokenSchema = z.object({
  name: z.string().trim().min(1, 'give the token a name').max(100),
});
export type CreateApiToken = z.infer<typeof createApiTokenSchema>;

/** The answer to `POST /api/tokens`: the secret appears here once and is never shown again. */
export const createdApiTokenSchema = apiTokenSchema.extend({
  token: z.string(),
});
export type CreatedApiToken = z.infer<typeof createdApiTokenSchema>;
