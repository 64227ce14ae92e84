import { z } from 'zod';

/** The closed list of error codes every API error carries. */
export const errorCodes = [
  'validation-failed',
  'unauthenticated',
  'forbidden',
  'not-found',
  'conflict',
  'payload-too-large',
  'rate-limited',
  'internal',
] as const;

export const errorCodeSchema = z.enum(errorCodes);
export type ErrorCode = z.infer<typeof errorCodeSchema>;

/** The one error shape: `{ error: { code, message, details? } }`. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: errorCodeSchema,
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;
