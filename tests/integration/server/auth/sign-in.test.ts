import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { meSchema } from '@shared/api/me.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { userSessions } from '@server/db/schema/user-sessions.ts';
import { users } from '@server/db/schema/users.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { stableIdForLogin } from '@server/fake-github/fake-identity-book.ts';
import { CookieJar, get, signInAs, startSignInWorld, type SignInWorld } from './oauth-flow.ts';

let world: SignInWorld;
beforeAll(async () => {
  world = await startSignInWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

const [ines, tomas] = demoIdentities;

async function me(jar: CookieJar) {
  return get(`${world.app.url}/api/me`, jar);
}

describe('sign-in through the fake provider', () => {
  it('completes the round trip and /api/me shows the person', async () => {
    const { jar, landing } = await signInAs(world, ines!.login);
    expect(landing).toBe('/');
    const res = await me(jar);
    expect(res.status).toBe(200);
    const body = meSchema.parse(await res.json());
    expect(body.user).toMatchObject({ login: ines!.login, name: ines!.name, email: ines!.email });
    expect(body.teams).toEqual([]);

    const [row] = await world.app.database.db
      .select()
      .from(users)
      .where(eq(users.githubId, String(ines!.id)));
    expect(row?.id).toBe(body.user.id);
  });

  it('answers 401 without a session', async () => {
    const res = await me(new CookieJar());
    expect(res.status).toBe(401);
    expect(apiErrorSchema.parse(await res.json()).error.code).toBe('unauthenticated');
  });

  it('sets an httpOnly, SameSite=Lax session cookie', async () => {
    const res = await get(`${world.app.url}/auth/github`);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('stablehand.sid='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('gives a new session id at sign-in and the old one stays anonymous', async () => {
    const { jar, cookieBefore } = await signInAs(world, tomas!.login);
    const cookieAfter = jar.get('stablehand.sid');
    expect(cookieBefore).not.toBe('');
    expect(cookieAfter).toBeDefined();
    expect(cookieAfter).not.toBe(cookieBefore);

    const old = new CookieJar();
    old.set('stablehand.sid', cookieBefore);
    expect((await me(old)).status).toBe(401);
    expect((await me(jar)).status).toBe(200);
  });

  it('refuses a forged state and sends the browser to the failure page', async () => {
    const { jar, landing } = await signInAs(world, ines!.login, { forgeState: 'forged-state' });
    expect(landing).toBe('/?signin=failed');
    expect((await me(jar)).status).toBe(401);
  });

  it('refuses a callback that no sign-in of this browser started', async () => {
    // A browser with no session arrives at the callback with a code and a state of its own.
    const res = await get(`${world.app.url}/auth/github/callback?code=abc&state=xyz`);
    expect(res.status).toBe(302);
    expect(res.headers.get('location')).toBe('/?signin=failed');
  });

  it('signs in a typed new login with a stable provider id', async () => {
    const { jar } = await signInAs(world, 'new.structural-intern');
    const body = meSchema.parse(await (await me(jar)).json());
    expect(body.user.login).toBe('new.structural-intern');
    const [row] = await world.app.database.db
      .select({ githubId: users.githubId })
      .from(users)
      .where(eq(users.id, body.user.id));
    expect(row?.githubId).toBe(String(stableIdForLogin('new.structural-intern')));
  });

  it('returns to a same-origin path and never to another site', async () => {
    const inside = await signInAs(world, ines!.login, { returnTo: '/routines/lu?tab=logbook' });
    expect(inside.landing).toBe('/routines/lu?tab=logbook');
    for (const returnTo of ['//elsewhere.example/x', 'https://elsewhere.example/', '/\\evil']) {
      const outside = await signInAs(world, ines!.login, { returnTo });
      expect(outside.landing).toBe('/');
    }
  });

  it('ends the session on sign-out', async () => {
    const { jar } = await signInAs(world, tomas!.login);
    const sid = decodeURIComponent(jar.get('stablehand.sid')!).slice(2).split('.')[0]!;
    const stored = async () =>
      world.app.database.db.select().from(userSessions).where(eq(userSessions.sid, sid));
    expect(await stored()).toHaveLength(1);

    const res = await fetch(`${world.app.url}/auth/sign-out`, {
      method: 'POST',
      headers: { cookie: jar.header(), origin: world.app.url },
    });
    expect(res.status).toBe(204);
    expect(await stored()).toHaveLength(0);
    expect((await me(jar)).status).toBe(401);
  });
});
