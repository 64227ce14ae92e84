import type { RequestHandler } from 'express';
import type { Db } from '../db/client.ts';
import { AppError } from '../http/errors.ts';
import { userForApiToken } from './token-auth.ts';

/**
 * Sets `req.currentUser` from a Bearer API token. A request that presents a token that is not
 * valid (revoked, unknown, malformed) is refused outright rather than treated as anonymous.
 * Session sign-in is layered on by the session middleware (see auth/session.ts).
 */
export function authenticateBearer(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const header = req.headers.authorization;
    if (!header) {
      next();
      return;
    }
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    const user = match ? await userForApiToken(db, match[1]!) : null;
    if (!user)
      throw new AppError('unauthenticated', 'The API token is not valid or has been revoked.');
    req.currentUser = user;
    next();
  };
}
