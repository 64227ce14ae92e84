import { afterEach, describe, expect, inject, it } from 'vitest';
import { meSchema } from '@shared/api/me.ts';
import { users } from '@server/db/schema/users.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import {
  createFreshDatabase,
  get,
  signInAs,
  startSignInWorld,
  type SignInWorld,
} from './oauth-flow.ts';

// Each test gets an empty database of its own: the shared test database already has users.
const cleanups: (() => Promise<void>)[] = [];
afterEach(async () => {
  while (cleanups.length) await cleanups.pop()!();
});

async function freshWorld(): Promise<SignInWorld> {
  const fresh = await createFreshDatabase(inject('databaseUrl'));
  cleanups.push(fresh.drop);
  const world = await startSignInWorld(fresh.url);
  cleanups.push(world.close);
  return world;
}

async function meAfterSignIn(world: SignInWorld, login: string) {
  const { jar } = await signInAs(world, login);
  return meSchema.parse(await (await get(`${world.app.url}/api/me`, jar)).json());
}

describe('the first user of a fresh instance', () => {
  it('becomes admin; the second does not; signing in again changes neither', async () => {
    const world = await freshWorld();
    const [first, second] = demoIdentities;
    expect((await meAfterSignIn(world, first!.login)).user.isAdmin).toBe(true);
    expect((await meAfterSignIn(world, second!.login)).user.isAdmin).toBe(false);
    expect((await meAfterSignIn(world, first!.login)).user.isAdmin).toBe(true);
    expect((await meAfterSignIn(world, second!.login)).user.isAdmin).toBe(false);
  });

  it('is exactly one admin when several people sign in at the same moment', async () => {
    const world = await freshWorld();
    const results = await Promise.all(
      demoIdentities.map((person) => meAfterSignIn(world, person.login)),
    );
    expect(results.filter((r) => r.user.isAdmin)).toHaveLength(1);
    const rows = await world.app.database.db.select().from(users);
    expect(rows).toHaveLength(demoIdentities.length);
    expect(rows.filter((r) => r.isAdmin)).toHaveLength(1);
  });
});
