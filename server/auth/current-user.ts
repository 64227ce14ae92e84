import type { Request } from 'express';
import { AppError } from '../http/errors.ts';

/** The signed-in person, however they authenticated. */
export interface CurrentUser {
  id: number;
  login: string;
  isAdmin: boolean;
  via: 'session' | 'token';
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by the authenticate middleware; undefined for anonymous requests. */
    currentUser?: CurrentUser;
  }
}

/** The signed-in person, or a 401 `unauthenticated` error. */
export function requireUser(req: Request): CurrentUser {
  if (!req.currentUser) throw new AppError('unauthenticated', 'Sign in first.');
  return req.currentUser;
}
