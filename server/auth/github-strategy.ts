import { Strategy as GitHubStrategy, type Profile } from 'passport-github2';
import { publicUrl, type Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import type { GithubPerson } from './sign-in.repo.ts';
import { signInWithGithub } from './sign-in.service.ts';

export const GITHUB_CALLBACK_PATH = '/auth/github/callback';

/** The parts of the provider's profile we keep, or null when it lacks an id or a login. */
export function personFromProfile(profile: Profile): GithubPerson | null {
  const login = profile.username?.trim();
  if (!profile.id || !login) return null;
  return {
    githubId: String(profile.id),
    login,
    name: profile.displayName?.trim() || null,
    email: profile.emails?.[0]?.value ?? null,
  };
}

/**
 * Sign-in with a GitHub-compatible provider: the real one in production, the local fake in
 * development and tests; every address comes from the environment. `state: true` makes
 * passport-oauth2 keep a nonce in the session and check it on the way back.
 */
export function createGithubStrategy(db: Db, env: Env): GitHubStrategy {
  return new GitHubStrategy(
    {
      clientID: env.GITHUB_CLIENT_ID,
      clientSecret: env.GITHUB_CLIENT_SECRET,
      callbackURL: `${publicUrl(env)}${GITHUB_CALLBACK_PATH}`,
      authorizationURL: env.GITHUB_AUTHORIZE_URL,
      tokenURL: env.GITHUB_TOKEN_URL,
      userProfileURL: env.GITHUB_PROFILE_URL,
      userEmailURL: `${env.GITHUB_PROFILE_URL.replace(/\/$/, '')}/emails`,
      scope: ['read:user', 'user:email'],
      userAgent: 'stablehand',
      // The typings declare `state` as a string; passport-oauth2 wants `true` for its session store.
      state: true as unknown as string,
    },
    (_accessToken: string, _refreshToken: string, profile: Profile, done: DoneFn) => {
      const person = personFromProfile(profile);
      if (!person) {
        done(null, false);
        return;
      }
      signInWithGithub(db, person).then((user) => done(null, user ?? false), done);
    },
  );
}

type DoneFn = (err: unknown, user?: Express.User | false) => void;
