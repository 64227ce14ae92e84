import type { z } from 'zod';
import { apiErrorSchema, type ErrorCode } from '@shared/errors.ts';
import { parseWithNonFinite } from '@shared/json-numbers.ts';

/** An API failure carrying the shared error shape `{ error: { code, message, details? } }`. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** The old name, kept for code written against it. */
export { ApiError as ApiRequestError };

export function isApiError(error: unknown, code?: ApiError['code']): error is ApiError {
  return error instanceof ApiError && (code === undefined || error.code === code);
}

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface RequestOptions<T> {
  method?: HttpMethod;
  /** A JSON body (serialised here) or a FormData for uploads (multipart). */
  body?: unknown;
  /** Parses the answer; omit for answers without a body (204). */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
  /** Read "Infinity", "-Infinity" and "NaN" strings as numbers (trial reports). */
  nonFinite?: boolean;
  /** Some routes (health) answer a failure with their own body; let the schema read it. */
  schemaOnFailure?: boolean;
}

/**
 * The one way the client talks to the API: same-origin with the session cookie, the error
 * shape turned into an ApiError, and the answer checked against its shared zod schema.
 */
export async function apiRequest<T = void>(
  path: string,
  options: RequestOptions<T> = {},
): Promise<T> {
  const { method = 'GET', body, schema, signal, nonFinite = false } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  let payload: BodyInit | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: payload ?? null,
      credentials: 'same-origin',
      signal: signal ?? null,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'network', 'The server could not be reached.');
  }
  const text = await response.text();
  let parsed: unknown = null;
  if (text !== '') {
    try {
      parsed = nonFinite ? parseWithNonFinite(text) : JSON.parse(text);
    } catch {
      parsed = text;
    }
  }
  if (!response.ok) {
    const shaped = apiErrorSchema.safeParse(parsed);
    if (shaped.success) {
      const { code, message, details } = shaped.data.error;
      throw new ApiError(response.status, code, message, details);
    }
    if (options.schemaOnFailure && schema) {
      const own = schema.safeParse(parsed);
      if (own.success) return own.data;
    }
    throw new ApiError(response.status, 'internal', `Request failed (${response.status}).`);
  }
  if (!schema) return undefined as T;
  const result = schema.safeParse(parsed);
  if (!result.success) {
    console.error(`Unexpected answer from ${method} ${path}`, result.error.issues);
    throw new ApiError(
      response.status,
      'internal',
      'The server answered in a shape this page does not understand.',
      result.error.issues,
    );
  }
  return result.data;
}

/** GET a JSON route and parse it with its shared schema. */
export function apiGet<T>(path: string, schema: z.ZodType<T>, signal?: AbortSignal): Promise<T> {
  return apiRequest(path, { schema, signal, schemaOnFailure: true });
}

/** POST/PUT/PATCH/DELETE with a JSON or multipart body. */
export function apiSend<T = void>(
  method: Exclude<HttpMethod, 'GET'>,
  path: string,
  body?: unknown,
  schema?: z.ZodType<T>,
): Promise<T> {
  return apiRequest(path, { method, body, schema });
}

/** Builds `?a=1&b=2` from the defined entries only. */
export function queryString(params: Record<string, string | number | boolean | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined) search.set(key, String(value));
  }
  const s = search.toString();
  return s === '' ? '' : `?${s}`;
}
