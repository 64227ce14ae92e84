import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { meSchema } from '@shared/api/me.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { createTestUser } from '@tests/helpers/users.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';

let app: RunningApp;
beforeAll(async () => {
  app = await startTestApp(inject('databaseUrl'));
});
afterAll(() => app.close());

describe('GET /api/me', () => {
  it('lists the caller’s teams with their role in each, and no one else’s', async () => {
    const { db } = app.database;
    const person = await createTestUser(db, { isAdmin: true });
    const other = await createTestUser(db);
    const [frames, gauges, elsewhere] = await db
      .insert(teams)
      .values([
        { slug: `frames-${person.id}`, name: 'Frame analysis' },
        { slug: `gauges-${person.id}`, name: 'Gauge solvers' },
        { slug: `other-${person.id}`, name: 'Other team' },
      ])
      .returning();
    await db.insert(memberships).values([
      { teamId: gauges!.id, userId: person.id, role: 'maintainer' },
      { teamId: frames!.id, userId: person.id, role: 'reviewer' },
      { teamId: elsewhere!.id, userId: other.id, role: 'author' },
    ]);

    const res = await fetch(`${app.url}/api/me`, { headers: person.headers });
    expect(res.status).toBe(200);
    const me = meSchema.parse(await res.json());
    expect(me.user).toEqual({
      id: person.id,
      login: person.login,
      name: null,
      email: `${person.login}@example.test`,
      isAdmin: true,
    });
    expect(me.teams).toEqual([
      { id: frames!.id, slug: frames!.slug, name: 'Frame analysis', role: 'reviewer' },
      { id: gauges!.id, slug: gauges!.slug, name: 'Gauge solvers', role: 'maintainer' },
    ]);
  });

  it('refuses a malformed Bearer header with 401 rather than treating it as anonymous', async () => {
    const res = await fetch(`${app.url}/api/me`, { headers: { authorization: 'Bearer nope' } });
    expect(res.status).toBe(401);
  });
});
