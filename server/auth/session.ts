import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { publicUrl, type Env } from '@server/config/env.ts';
import type { Database } from '@server/db/client.ts';
import type { CurrentUser } from './current-user.ts';
import { sessionUser } from './sign-in.service.ts';

declare module 'express-session' {
  interface SessionData {
    /** Where to send the person after sign-in: a path on this site, checked before it is stored. */
    returnTo?: string;
  }
}

/** One passport instance (the app's own, see createSessionAuth). */
export type Authenticator = InstanceType<typeof passport.Passport>;

export const SESSION_COOKIE = 'stablehand.sid';
const SESSION_DAYS = 14;

export interface SessionAuth {
  /** This app's own passport instance (not the module singleton, so apps in one process stay apart). */
  authenticator: Authenticator;
  /** express-session, passport and `req.currentUser`, in that order. */
  middleware: RequestHandler[];
  /** Options for clearing the session cookie; they must match the ones it was set with. */
  cookie: { path: string; httpOnly: boolean; sameSite: 'lax'; secure: boolean };
}

/**
 * Sessions kept in PostgreSQL (the migrated `user_sessions` table) behind an httpOnly, SameSite=Lax
 * cookie, secure when the public address is https. A session stores only the user id; each request
 * loads the user afresh, so a deleted user or a changed admin flag takes effect at once.
 */
export function createSessionAuth(database: Database, env: Env): SessionAuth {
  const PgStore = connectPgSimple(session);
  const cookie = {
    path: '/',
    httpOnly: true,
    sameSite: 'lax' as const,
    secure: publicUrl(env).startsWith('https:'),
  };
  const sessions = session({
    name: SESSION_COOKIE,
    secret: env.SESSION_SECRET,
    store: new PgStore({
      pool: database.pool,
      tableName: 'user_sessions',
      createTableIfMissing: false,
    }),
    resave: false,
    saveUninitialized: false,
    cookie: { ...cookie, maxAge: SESSION_DAYS * 24 * 60 * 60 * 1000 },
  });

  const authenticator = new passport.Passport();
  authenticator.serializeUser((user, done) => done(null, (user as CurrentUser).id));
  authenticator.deserializeUser((id: unknown, done) => {
    if (typeof id !== 'number') {
      done(null, false);
      return;
    }
    sessionUser(database.db, id).then((user) => done(null, user ?? false), done);
  });

  // The Bearer middleware runs after this one and replaces the user when a token is presented,
  // so both ways of signing in end in the one `req.currentUser`.
  const currentUserFromSession: RequestHandler = (req, _res, next) => {
    if (req.user && !req.currentUser) req.currentUser = req.user as CurrentUser;
    next();
  };

  return {
    authenticator,
    middleware: [
      sessions,
      authenticator.initialize(),
      authenticator.session(),
      currentUserFromSession,
    ],
    cookie,
  };
}
