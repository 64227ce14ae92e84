import type { z } from 'zod';
import { apiErrorSchema, type ErrorCode } from '@shared/errors.ts';

/** An API failure carrying the shared error shape. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiRequestError';
  }
}

/** Fetches a JSON route and parses the response with its shared zod schema. */
export async function apiGet<T>(
  path: string,
  schema: z.ZodType<T>,
  signal?: AbortSignal,
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      headers: { Accept: 'application/json' },
      signal: signal ?? null,
    });
  } catch {
    throw new ApiRequestError(0, 'network', 'The server could not be reached.');
  }
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = apiErrorSchema.safeParse(body);
    if (parsed.success) {
      const { code, message, details } = parsed.data.error;
      throw new ApiRequestError(response.status, code, message, details);
    }
    // Some routes (health) answer a failure with their own body; let the schema decide.
    const own = schema.safeParse(body);
    if (own.success) return own.data;
    throw new ApiRequestError(response.status, 'internal', `Request failed (${response.status}).`);
  }
  return schema.parse(body);
}
