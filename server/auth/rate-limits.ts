import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Env } from '@server/config/env.ts';
import { AppError } from '@server/http/errors.ts';

export interface RateLimits {
  /** Starting and finishing sign-in, per client address. */
  signIn: RequestHandler;
  /** Requests whose Bearer token is refused, per client address (guessing tokens). */
  tokenFailures: RequestHandler;
  /** New candidates and revisions, per signed-in person. */
  submissions: RequestHandler;
}

const pass: RequestHandler = (_req, _res, next) => next();

/** A fixed-window limit of `limit` requests per window; 0 turns it off. */
function limiter(
  env: Env,
  limit: number,
  what: string,
  options: Partial<Parameters<typeof rateLimit>[0]> = {},
): RequestHandler {
  if (limit === 0) return pass;
  const seconds = env.RATE_LIMIT_WINDOW_SECONDS;
  return rateLimit({
    windowMs: seconds * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // The one error shape, through the error handler.
    handler: (_req, _res, next) =>
      next(
        new AppError(
          'rate-limited',
          `Too many ${what}: at most ${limit} in ${seconds} seconds. Try again later.`,
        ),
      ),
    ...options,
  });
}

const personKey = (req: Request): string =>
  req.currentUser ? `user:${req.currentUser.id}` : ipKeyGenerator(req.ip ?? '');

/**
 * The rate limits (express-rate-limit, in-memory per process), sized by RATE_LIMIT_* in
 * config/env.ts. A refused request gets 429 `rate-limited` with RateLimit headers.
 */
export function createRateLimits(env: Env): RateLimits {
  return {
    signIn: limiter(env, env.RATE_LIMIT_SIGN_IN, 'sign-in attempts'),
    tokenFailures: limiter(
      env,
      env.RATE_LIMIT_TOKEN_FAILURES,
      'requests with a refused API token',
      {
        skip: (req) => !req.headers.authorization,
        // Only refused tokens count: a valid token's requests are not limited here.
        requestWasSuccessful: (_req, res) => res.statusCode !== 401,
        skipSuccessfulRequests: true,
      },
    ),
    submissions: limiter(env, env.RATE_LIMIT_SUBMISSIONS, 'submissions', {
      keyGenerator: personKey,
    }),
  };
}
