import express, { type Request, type Router } from 'express';
import { publicUrl, type Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import type { CurrentUser } from './current-user.ts';
import { createGithubStrategy } from './github-strategy.ts';
import { safeReturnTo } from './return-to.ts';
import { SESSION_COOKIE, type SessionAuth } from './session.ts';

export const SIGN_IN_FAILED_PATH = '/?signin=failed';

/**
 * `GET /auth/github` starts sign-in with the provider (with an optional same-origin `returnTo`),
 * `GET /auth/github/callback` finishes it, `POST /auth/sign-out` ends the session.
 */
export function authRouter(deps: { db: Db; env: Env; sessionAuth: SessionAuth }): Router {
  const { db, env, sessionAuth } = deps;
  const { authenticator } = sessionAuth;
  authenticator.use('github', createGithubStrategy(db, env));
  const router = express.Router();

  router.get('/github', (req, res, next) => {
    const returnTo = safeReturnTo(req.query.returnTo, publicUrl(env));
    if (returnTo) req.session.returnTo = returnTo;
    else delete req.session.returnTo;
    authenticator.authenticate('github', { session: false })(req, res, next);
  });

  router.get('/github/callback', (req, res, next) => {
    // Read before sign-in: logging in regenerates the session, which drops everything in it.
    const returnTo = req.session.returnTo ?? '/';
    const finish = (err: unknown, user: CurrentUser | false | undefined) => {
      if (err || !user) {
        if (err) req.log.warn({ err }, 'sign-in with the provider failed');
        delete req.session.returnTo;
        res.redirect(SIGN_IN_FAILED_PATH);
        return;
      }
      req.logIn(user, (loginErr?: unknown) => {
        if (loginErr) {
          next(loginErr);
          return;
        }
        res.redirect(returnTo);
      });
    };
    authenticator.authenticate('github', finish)(req, res, next);
  });

  router.post('/sign-out', async (req, res) => {
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, sessionAuth.cookie);
    res.status(204).end();
  });

  return router;
}

function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) {
      resolve();
      return;
    }
    req.session.destroy((err: unknown) => (err ? reject(err) : resolve()));
  });
}
