import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ApiError, ErrorCode } from '@shared/errors.ts';

const statusByCode: Record<ErrorCode, number> = {
  'validation-failed': 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'payload-too-large': 413,
  'rate-limited': 429,
  internal: 500,
};

/** An error meant for the client: its message is safe to show. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
    this.status = statusByCode[code];
  }
}

function body(code: ErrorCode, message: string, details?: unknown): ApiError {
  return details === undefined
    ? { error: { code, message } }
    : { error: { code, message, details } };
}

/** Any `/api` path that no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(body('not-found', `No API route ${req.method} ${req.path}`));
};

/** The one error middleware, mounted last. Unknown errors are logged, never echoed. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, next) => {
  if (res.headersSent) {
    next(err);
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (err instanceof ZodError) {
    const details = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    res.status(400).json(body('validation-failed', 'The request is not valid.', details));
    return;
  }
  if (isBodyParserError(err)) {
    const tooLarge = err.type === 'entity.too.large';
    res
      .status(tooLarge ? 413 : 400)
      .json(
        body(
          tooLarge ? 'payload-too-large' : 'validation-failed',
          tooLarge ? 'The request body is too large.' : 'The request body is not valid JSON.',
        ),
      );
    return;
  }
  req.log.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on our side.'));
};

function isBodyParserError(err: unknown): err is { type: string; status: number } {
  return (
    typeof err === 'object' &&
    err !== null &&
    'type' in err &&
    typeof (err as { type: unknown }).type === 'string' &&
    'status' in err
  );
}
