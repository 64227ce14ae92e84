import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/errors.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createTestUser } from '@tests/helpers/users.ts';
import { signInAs, startSignInWorld, type CookieJar, type SignInWorld } from './oauth-flow.ts';

let world: SignInWorld;
let jar: CookieJar;
beforeAll(async () => {
  world = await startSignInWorld(inject('databaseUrl'));
  ({ jar } = await signInAs(world, demoIdentities[2]!.login));
});
afterAll(() => world.close());

const foreign = 'http://elsewhere.example';

function postToken(headers: Record<string, string>, body = JSON.stringify({ name: 'laptop' })) {
  return fetch(`${world.app.url}/api/tokens`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: jar.header(), ...headers },
    body,
  });
}

async function expectRefused(res: Response) {
  expect(res.status).toBe(403);
  const body = apiErrorSchema.parse(await res.json());
  expect(body.error).toEqual({ code: 'forbidden', message: 'Cross-site request refused.' });
}

describe('cross-site writes with the session cookie', () => {
  it('refuses a form posted from another site', async () => {
    await expectRefused(
      await postToken(
        { origin: foreign, 'content-type': 'application/x-www-form-urlencoded' },
        'name=planted',
      ),
    );
  });

  it('refuses a foreign Origin, an opaque Origin, and a foreign Referer without Origin', async () => {
    await expectRefused(await postToken({ origin: foreign }));
    await expectRefused(await postToken({ origin: 'null', referer: `${world.app.url}/tokens` }));
    await expectRefused(await postToken({ referer: `${foreign}/page` }));
  });

  it('refuses a write that names no origin at all', async () => {
    await expectRefused(await postToken({}));
  });

  it('refuses sign-out from another site, so the session lives on', async () => {
    const res = await fetch(`${world.app.url}/auth/sign-out`, {
      method: 'POST',
      headers: { cookie: jar.header(), origin: foreign },
    });
    await expectRefused(res);
    const me = await fetch(`${world.app.url}/api/me`, { headers: { cookie: jar.header() } });
    expect(me.status).toBe(200);
  });

  it('accepts our own Origin, or our own Referer when Origin is missing', async () => {
    expect((await postToken({ origin: world.app.url })).status).toBe(201);
    expect((await postToken({ referer: `${world.app.url}/settings/tokens` })).status).toBe(201);
  });

  it('lets reads through whatever their origin', async () => {
    const res = await fetch(`${world.app.url}/api/tokens`, {
      headers: { cookie: jar.header(), origin: foreign },
    });
    expect(res.status).toBe(200);
  });

  it('exempts Bearer-token requests, which carry no ambient credential', async () => {
    const person = await createTestUser(world.app.database.db);
    const res = await fetch(`${world.app.url}/api/tokens`, {
      method: 'POST',
      headers: { ...person.headers, origin: foreign },
      body: JSON.stringify({ name: 'ci' }),
    });
    expect(res.status).toBe(201);
  });
});
