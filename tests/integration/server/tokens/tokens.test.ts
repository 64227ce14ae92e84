import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { meSchema } from '@shared/api/me.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import {
  apiTokenPageSchema,
  apiTokenSchema,
  createdApiTokenSchema,
  type CreatedApiToken,
} from '@shared/api/tokens.ts';
import { hashSecret } from '@server/auth/api-token-secret.ts';
import { LAST_USED_RESOLUTION_MS } from '@server/auth/token-auth.ts';
import { apiTokens } from '@server/db/schema/api-tokens.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';
import {
  signInAs,
  startSignInWorld,
  type SignInWorld,
} from '@tests/integration/server/auth/oauth-flow.ts';

let world: SignInWorld;
let owner: TestUser;
let stranger: TestUser;
beforeAll(async () => {
  world = await startSignInWorld(inject('databaseUrl'));
  owner = await createTestUser(world.app.database.db);
  stranger = await createTestUser(world.app.database.db);
});
afterAll(() => world.close());

const api = (path: string) => `${world.app.url}/api${path}`;
const bearer = (token: string) => ({
  authorization: `Bearer ${token}`,
  'content-type': 'application/json',
});

async function create(headers: Record<string, string>, name: string): Promise<CreatedApiToken> {
  const res = await fetch(api('/tokens'), {
    method: 'POST',
    headers,
    body: JSON.stringify({ name }),
  });
  expect(res.status).toBe(201);
  return createdApiTokenSchema.parse(await res.json());
}

describe('API tokens', () => {
  it('creates a token whose secret is shown once and stored only as a hash', async () => {
    const created = await create(owner.headers, '  workstation  ');
    expect(created.name).toBe('workstation');
    expect(created.token.startsWith(created.prefix)).toBe(true);
    expect(created.revokedAt).toBeNull();

    const [row] = await world.app.database.db
      .select()
      .from(apiTokens)
      .where(eq(apiTokens.id, created.id));
    expect(row?.tokenHash).toBe(hashSecret(created.token));
    expect(Object.values(row!)).not.toContain(created.token);

    const list = await fetch(api('/tokens'), { headers: owner.headers });
    const text = await list.text();
    expect(text).not.toContain(created.token);
    const page = apiTokenPageSchema.parse(JSON.parse(text));
    expect(page.items.map((t) => t.id)).toContain(created.id);
    expect(page.items.every((t) => !('token' in t))).toBe(true);
  });

  it('authenticates with the new token and records its last use', async () => {
    const created = await create(owner.headers, 'ci runner');
    const res = await fetch(api('/me'), { headers: bearer(created.token) });
    expect(res.status).toBe(200);
    expect(meSchema.parse(await res.json()).user.login).toBe(owner.login);
    const page = apiTokenPageSchema.parse(
      await (await fetch(api('/tokens'), { headers: owner.headers })).json(),
    );
    expect(page.items.find((t) => t.id === created.id)?.lastUsedAt).not.toBeNull();
  });

  it('writes the last use at most once a minute per token', async () => {
    const created = await create(owner.headers, 'busy runner');
    const lastUsed = async () => {
      const [row] = await world.app.database.db
        .select({ at: apiTokens.lastUsedAt })
        .from(apiTokens)
        .where(eq(apiTokens.id, created.id));
      return row!.at;
    };
    expect((await fetch(api('/me'), { headers: bearer(created.token) })).status).toBe(200);
    const first = await lastUsed();
    expect(first).not.toBeNull();
    expect((await fetch(api('/me'), { headers: bearer(created.token) })).status).toBe(200);
    expect((await lastUsed())?.getTime()).toBe(first!.getTime());
    // A use more than a minute after the recorded one is written again.
    const longAgo = new Date(Date.now() - 2 * LAST_USED_RESOLUTION_MS);
    await world.app.database.db
      .update(apiTokens)
      .set({ lastUsedAt: longAgo })
      .where(eq(apiTokens.id, created.id));
    expect((await fetch(api('/me'), { headers: bearer(created.token) })).status).toBe(200);
    expect((await lastUsed())!.getTime()).toBeGreaterThan(
      longAgo.getTime() + LAST_USED_RESOLUTION_MS,
    );
  });

  it('lists only the caller’s own tokens, newest first, a page at a time', async () => {
    const person = await createTestUser(world.app.database.db);
    const a = await create(person.headers, 'first');
    const b = await create(person.headers, 'second');
    const res = await fetch(api('/tokens?limit=2'), { headers: person.headers });
    const page = apiTokenPageSchema.parse(await res.json());
    // The helper's own token is the third.
    expect(page.total).toBe(3);
    expect(page.items.map((t) => t.id)).toEqual([b.id, a.id]);
    const theirs = apiTokenPageSchema.parse(
      await (await fetch(api('/tokens'), { headers: stranger.headers })).json(),
    );
    expect(theirs.items.map((t) => t.id)).not.toContain(a.id);
  });

  it('revokes a token, which is refused on its next use', async () => {
    const created = await create(owner.headers, 'short-lived');
    expect((await fetch(api('/me'), { headers: bearer(created.token) })).status).toBe(200);
    const res = await fetch(api(`/tokens/${created.id}`), {
      method: 'DELETE',
      headers: owner.headers,
    });
    expect(res.status).toBe(200);
    expect(apiTokenSchema.parse(await res.json()).revokedAt).not.toBeNull();

    const reuse = await fetch(api('/me'), { headers: bearer(created.token) });
    expect(reuse.status).toBe(401);
    expect(apiErrorSchema.parse(await reuse.json()).error.code).toBe('unauthenticated');
  });

  it('answers 404 to someone revoking another person’s token, which stays live', async () => {
    const created = await create(owner.headers, 'not yours');
    const res = await fetch(api(`/tokens/${created.id}`), {
      method: 'DELETE',
      headers: stranger.headers,
    });
    expect(res.status).toBe(404);
    expect((await fetch(api('/me'), { headers: bearer(created.token) })).status).toBe(200);
    const missing = await fetch(api('/tokens/2147483000'), {
      method: 'DELETE',
      headers: owner.headers,
    });
    expect(missing.status).toBe(404);
  });

  it('requires a signed-in caller and a name', async () => {
    const anonymous = await fetch(api('/tokens'), {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'x' }),
    });
    expect(anonymous.status).toBe(401);
    expect((await fetch(api('/tokens'))).status).toBe(401);
    const unnamed = await fetch(api('/tokens'), {
      method: 'POST',
      headers: owner.headers,
      body: JSON.stringify({ name: '   ' }),
    });
    expect(unnamed.status).toBe(400);
    expect(apiErrorSchema.parse(await unnamed.json()).error.code).toBe('validation-failed');
  });

  it('lets a person signed in with the session cookie create and use a token', async () => {
    const { jar } = await signInAs(world, demoIdentities[3]!.login);
    const created = await create(
      { cookie: jar.header(), origin: world.app.url, 'content-type': 'application/json' },
      'from the browser',
    );
    const res = await fetch(api('/me'), { headers: bearer(created.token) });
    expect(meSchema.parse(await res.json()).user.login).toBe(demoIdentities[3]!.login);
  });
});
