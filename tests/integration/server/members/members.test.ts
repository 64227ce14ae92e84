import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { auditPageSchema } from '@shared/api/audit.ts';
import { memberPageSchema, memberSchema } from '@shared/api/members.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import {
  addMember,
  createTeamWorld,
  startTeamFixture,
  type TeamFixture,
} from '@tests/helpers/team-fixture.ts';
import { createTestUser } from '@tests/helpers/users.ts';

let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(() => f.close());

const roleOf = async (teamId: number, userId: number) => {
  const [row] = await f.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  return row?.role ?? null;
};

describe('members', () => {
  it('lists the members by login with their roles', async () => {
    const res = await f.call(`/teams/${f.team.id}/members`, f.people.author);
    expect(res.status).toBe(200);
    const page = memberPageSchema.parse(res.body);
    expect(page.total).toBe(3);
    const byId = Object.fromEntries(page.items.map((m) => [m.userId, m.role]));
    expect(byId).toEqual({
      [f.people.author.id]: 'author',
      [f.people.reviewer.id]: 'reviewer',
      [f.people.maintainer.id]: 'maintainer',
    });
    const logins = page.items.map((m) => m.login);
    expect(logins).toEqual([...logins].sort());
  });

  it('lets a maintainer change a role, and records the change', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const res = await f.call(
      `/teams/${team.id}/members/${people.author.id}`,
      people.maintainer,
      'PATCH',
      {
        role: 'reviewer',
      },
    );
    expect(res.status).toBe(200);
    expect(memberSchema.parse(res.body)).toMatchObject({
      userId: people.author.id,
      role: 'reviewer',
    });
    expect(await roleOf(team.id, people.author.id)).toBe('reviewer');

    const audit = auditPageSchema.parse(
      (await f.call(`/teams/${team.id}/audit`, people.maintainer)).body,
    );
    expect(audit.items[0]).toMatchObject({
      action: 'member.role-changed',
      entity: 'member',
      entityId: people.author.id,
      actor: { id: people.maintainer.id },
      details: { from: 'author', to: 'reviewer', login: people.author.login },
    });
  });

  it('lets an admin outside the team manage its members', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const url = `/teams/${team.id}/members/${people.reviewer.id}`;
    expect((await f.call(url, people.admin, 'PATCH', { role: 'maintainer' })).status).toBe(200);
    expect(await roleOf(team.id, people.reviewer.id)).toBe('maintainer');
    expect((await f.call(url, people.admin, 'DELETE')).status).toBe(204);
    expect(await roleOf(team.id, people.reviewer.id)).toBeNull();
  });

  it('keeps at least one maintainer: demoting or removing the last one is 409', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const self = `/teams/${team.id}/members/${people.maintainer.id}`;
    const demote = await f.call(self, people.maintainer, 'PATCH', { role: 'author' });
    expect(demote.status).toBe(409);
    expect(demote.body).toMatchObject({
      error: { code: 'conflict', message: expect.stringMatching(/only maintainer/) },
    });
    const remove = await f.call(self, people.admin, 'DELETE');
    expect(remove.status).toBe(409);
    expect(await roleOf(team.id, people.maintainer.id)).toBe('maintainer');

    // With a second maintainer, the first may step down.
    await f.call(`/teams/${team.id}/members/${people.reviewer.id}`, people.maintainer, 'PATCH', {
      role: 'maintainer',
    });
    expect((await f.call(self, people.maintainer, 'PATCH', { role: 'author' })).status).toBe(200);
    expect(await roleOf(team.id, people.maintainer.id)).toBe('author');
  });

  it('lets only one of two maintainers demoting each other at once succeed', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const second = await createTestUser(f.db);
    await addMember(f.db, team.id, second, 'maintainer');
    const [a, b] = await Promise.all([
      f.call(`/teams/${team.id}/members/${second.id}`, people.maintainer, 'PATCH', {
        role: 'author',
      }),
      f.call(`/teams/${team.id}/members/${people.maintainer.id}`, second, 'PATCH', {
        role: 'author',
      }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const rows = await f.db
      .select()
      .from(memberships)
      .where(and(eq(memberships.teamId, team.id), eq(memberships.role, 'maintainer')));
    expect(rows).toHaveLength(1);
  });

  it('removes a member and writes one audit row; an unchanged role writes none', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const same = await f.call(
      `/teams/${team.id}/members/${people.author.id}`,
      people.maintainer,
      'PATCH',
      {
        role: 'author',
      },
    );
    expect(same.status).toBe(200);
    const res = await f.call(
      `/teams/${team.id}/members/${people.author.id}`,
      people.maintainer,
      'DELETE',
    );
    expect(res.status).toBe(204);
    expect(await roleOf(team.id, people.author.id)).toBeNull();
    const rows = await f.db.select().from(auditLog).where(eq(auditLog.teamId, team.id));
    expect(rows.map((r) => [r.action, r.entityId, r.details])).toEqual([
      ['member.removed', people.author.id, { login: people.author.login, role: 'author' }],
    ]);
    const again = await f.call(
      `/teams/${team.id}/members/${people.author.id}`,
      people.maintainer,
      'DELETE',
    );
    expect(again.status).toBe(404);
  });

  it('refuses bad roles, unknown fields and bad ids with 400', async () => {
    const url = `/teams/${f.team.id}/members/${f.people.author.id}`;
    for (const body of [{ role: 'owner' }, { role: 3 }, {}, { role: 'author', note: 'x' }]) {
      const res = await f.call(url, f.people.maintainer, 'PATCH', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body).toMatchObject({
        error: { code: 'validation-failed', details: expect.any(Array) },
      });
    }
    expect(
      (await f.call(`/teams/${f.team.id}/members/abc`, f.people.maintainer, 'DELETE')).status,
    ).toBe(400);
    expect(
      (await f.call(`/teams/${f.team.id}/members/99999999`, f.people.maintainer, 'DELETE')).status,
    ).toBe(404);
  });
});
