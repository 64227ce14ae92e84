import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import pg from 'pg';
import { expect } from 'vitest';
import { migrateDatabase } from '@server/db/migrate.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';

/** Cookies carried by hand between fetch calls (Node's fetch keeps none). */
export class CookieJar {
  private readonly cookies = new Map<string, string>();

  take(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair = '', ...attributes] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attributes.some(
        (a) => /^\s*expires=/i.test(a) && Date.parse(a.split('=')[1]!) <= Date.now(),
      );
      if (!value || expired) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  set(name: string, value: string): void {
    this.cookies.set(name, value);
  }

  get(name: string): string | undefined {
    return this.cookies.get(name);
  }

  header(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }
}

/** The app and a fake provider wired to each other, both on free loopback ports. */
export interface SignInWorld {
  app: RunningApp;
  fakeUrl: string;
  close: () => Promise<void>;
}

export async function startSignInWorld(databaseUrl: string): Promise<SignInWorld> {
  const fake: Server = await new Promise((resolve) => {
    const s = createFakeGithubApp({ identities: demoIdentities }).listen(0, '127.0.0.1', () =>
      resolve(s),
    );
  });
  const fakeUrl = `http://127.0.0.1:${(fake.address() as AddressInfo).port}`;
  const app = await startTestApp(databaseUrl, undefined, {
    GITHUB_AUTHORIZE_URL: `${fakeUrl}/login/oauth/authorize`,
    GITHUB_TOKEN_URL: `${fakeUrl}/login/oauth/access_token`,
    GITHUB_PROFILE_URL: `${fakeUrl}/user`,
  });
  return {
    app,
    fakeUrl,
    close: async () => {
      await app.close();
      fake.closeAllConnections();
      await new Promise<void>((resolve) => fake.close(() => resolve()));
    },
  };
}

export const get = (url: string, jar?: CookieJar, headers: Record<string, string> = {}) =>
  fetch(url, { redirect: 'manual', headers: jar ? { ...headers, cookie: jar.header() } : headers });

export interface SignInTrace {
  jar: CookieJar;
  /** The session cookie set when sign-in started, before the provider was visited. */
  cookieBefore: string;
  /** Where the callback sent the browser. */
  landing: string;
}

/**
 * Walks the whole sign-in as a browser would: our `/auth/github`, the provider's screen, a click
 * on one person (or a typed login), the callback. `forgeState` replaces the state the app sent.
 */
export async function signInAs(
  world: SignInWorld,
  login: string,
  options: { returnTo?: string; forgeState?: string; jar?: CookieJar } = {},
): Promise<SignInTrace> {
  const jar = options.jar ?? new CookieJar();
  const start = new URL(`${world.app.url}/auth/github`);
  if (options.returnTo !== undefined) start.searchParams.set('returnTo', options.returnTo);
  const begun = await get(start.toString(), jar);
  expect(begun.status).toBe(302);
  jar.take(begun);
  const cookieBefore = jar.get('stablehand.sid') ?? '';

  const authorize = new URL(begun.headers.get('location')!);
  expect(authorize.origin).toBe(world.fakeUrl);
  const screen = await get(authorize.toString());
  expect(screen.status).toBe(200);

  const form = new URLSearchParams({
    client_id: authorize.searchParams.get('client_id')!,
    redirect_uri: authorize.searchParams.get('redirect_uri')!,
    state: options.forgeState ?? authorize.searchParams.get('state')!,
    login,
  });
  const chosen = await fetch(`${world.fakeUrl}/login/oauth/authorize`, {
    method: 'POST',
    redirect: 'manual',
    body: form,
  });
  expect(chosen.status).toBe(303);

  const callback = await get(chosen.headers.get('location')!, jar);
  expect(callback.status).toBe(302);
  jar.take(callback);
  return { jar, cookieBefore, landing: callback.headers.get('location')! };
}

/** A database of its own, migrated and empty: a fresh instance, unlike the shared test one. */
export async function createFreshDatabase(
  sharedUrl: string,
): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `fresh_${process.pid}_${Date.now()}_${Math.floor(Math.random() * 1e6)}`;
  const adminUrl = new URL(sharedUrl);
  adminUrl.pathname = '/postgres';
  const run = async (statement: string) => {
    const client = new pg.Client({ connectionString: adminUrl.toString() });
    await client.connect();
    try {
      await client.query(statement);
    } finally {
      await client.end();
    }
  };
  await run(`create database "${name}"`);
  const url = new URL(sharedUrl);
  url.pathname = `/${name}`;
  await migrateDatabase(url.toString());
  return { url: url.toString(), drop: () => run(`drop database if exists "${name}" with (force)`) };
}
