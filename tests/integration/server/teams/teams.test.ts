import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { auditPageSchema } from '@shared/api/audit.ts';
import { teamDetailSchema, teamPageSchema } from '@shared/api/teams.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { startTeamFixture, type TeamFixture } from '@tests/helpers/team-fixture.ts';
import { createTestUser } from '@tests/helpers/users.ts';

let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(() => f.close());

const uniqueSlug = (word: string) => `${word}-${Math.random().toString(36).slice(2, 8)}`;

describe('teams', () => {
  it('lists only my teams, with my role; an admin sees every team', async () => {
    const mine = teamPageSchema.parse((await f.call('/teams', f.people.reviewer)).body);
    expect(mine.items).toEqual([
      expect.objectContaining({ id: f.team.id, slug: f.team.slug, myRole: 'reviewer' }),
    ]);
    expect(mine.total).toBe(1);

    const all = teamPageSchema.parse((await f.call('/teams?limit=100', f.people.admin)).body);
    const ids = all.items.map((t) => t.id);
    expect(ids).toEqual(expect.arrayContaining([f.team.id, f.otherTeam.id]));
    expect(all.items.find((t) => t.id === f.team.id)?.myRole).toBeNull();
    expect(all.total).toBeGreaterThanOrEqual(2);
  });

  it('pages the list with limit and offset', async () => {
    const first = teamPageSchema.parse((await f.call('/teams?limit=1', f.people.admin)).body);
    const second = teamPageSchema.parse(
      (await f.call('/teams?limit=1&offset=1', f.people.admin)).body,
    );
    expect(first.items).toHaveLength(1);
    expect(second.items).toHaveLength(1);
    expect(second.items[0]!.id).not.toBe(first.items[0]!.id);
    expect(second.offset).toBe(1);
  });

  it('shows a team to its members with counts, and to an admin with no role', async () => {
    const res = await f.call(`/teams/${f.team.id}`, f.people.author);
    expect(res.status).toBe(200);
    const team = teamDetailSchema.parse(res.body);
    expect(team).toMatchObject({ id: f.team.id, name: f.team.name, myRole: 'author' });
    expect(team.counts).toMatchObject({ members: 3, maintainers: 1, routines: 0 });

    const asAdmin = teamDetailSchema.parse(
      (await f.call(`/teams/${f.team.id}`, f.people.admin)).body,
    );
    expect(asAdmin.myRole).toBeNull();
  });

  it('hides a team from people outside it, exactly like a missing one', async () => {
    const other = await f.call(`/teams/${f.team.id}`, f.people.outsider);
    const missing = await f.call('/teams/99999999', f.people.outsider);
    expect(other.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(other.body).toEqual(missing.body);
  });

  it('lets an admin create a team and become its maintainer, with audit rows', async () => {
    const slug = uniqueSlug('gauge-lab');
    const res = await f.call('/teams', f.people.admin, 'POST', { name: 'Gauge Lab', slug });
    expect(res.status).toBe(201);
    const team = teamDetailSchema.parse(res.body);
    expect(team).toMatchObject({ slug, name: 'Gauge Lab', myRole: 'maintainer' });
    expect(team.counts.maintainers).toBe(1);

    const audit = auditPageSchema.parse(
      (await f.call(`/teams/${team.id}/audit`, f.people.admin)).body,
    );
    expect(audit.items.map((a) => a.action).sort()).toEqual(['member.added', 'team.created']);
    expect(audit.items[0]!.actor).toEqual({ id: f.people.admin.id, login: f.people.admin.login });
  });

  it('makes the named person maintainer instead of the admin', async () => {
    const lead = await createTestUser(f.db);
    const slug = uniqueSlug('pump-curves');
    const res = await f.call('/teams', f.people.admin, 'POST', {
      name: 'Pump Curves',
      slug,
      maintainerLogin: lead.login,
    });
    expect(res.status).toBe(201);
    const team = teamDetailSchema.parse(res.body);
    expect(team.myRole).toBeNull();
    const rows = await f.db.select().from(memberships).where(eq(memberships.teamId, team.id));
    expect(rows.map((r) => [r.userId, r.role])).toEqual([[lead.id, 'maintainer']]);

    const unknown = await f.call('/teams', f.people.admin, 'POST', {
      name: 'Nobody',
      slug: uniqueSlug('nobody'),
      maintainerLogin: 'no-such-person-here',
    });
    expect(unknown.status).toBe(400);
    expect(unknown.body).toMatchObject({ error: { details: [{ path: 'maintainerLogin' }] } });
  });

  it('refuses a taken slug with 409 and writes nothing', async () => {
    const before = await f.db.select().from(teams);
    const res = await f.call('/teams', f.people.admin, 'POST', {
      name: 'Again',
      slug: f.team.slug,
    });
    expect(res.status).toBe(409);
    expect(res.body).toMatchObject({ error: { code: 'conflict' } });
    expect(await f.db.select().from(teams)).toHaveLength(before.length);
  });

  it('refuses bad bodies and ids with 400 and field details', async () => {
    const cases: [unknown, string][] = [
      [{ name: 'X', slug: 'Not A Slug' }, 'slug'],
      [{ name: 42, slug: 'fine-slug' }, 'name'],
      [{ name: 'X', slug: 'fine-slug', owner: 'me' }, ''],
      [{}, 'name'],
    ];
    for (const [body, path] of cases) {
      const res = await f.call('/teams', f.people.admin, 'POST', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body).toMatchObject({
        error: {
          code: 'validation-failed',
          details: expect.arrayContaining([expect.objectContaining({ path })]),
        },
      });
    }
    for (const id of ['abc', '0', '-3', '1.5', '99999999999']) {
      expect((await f.call(`/teams/${id}`, f.people.author)).status, id).toBe(400);
    }
    expect((await f.call('/teams?limit=1000', f.people.author)).status).toBe(400);
  });

  it('pages the audit log newest first', async () => {
    const slug = uniqueSlug('audit-trail');
    const created = teamDetailSchema.parse(
      (await f.call('/teams', f.people.admin, 'POST', { name: 'Audit Trail', slug })).body,
    );
    await f.call(`/teams/${created.id}/invitations`, f.people.admin, 'POST', {
      email: 'new.colleague@frame.example',
      role: 'author',
    });
    const first = auditPageSchema.parse(
      (await f.call(`/teams/${created.id}/audit?limit=1`, f.people.admin)).body,
    );
    expect(first.total).toBe(3);
    expect(first.items.map((a) => a.action)).toEqual(['invitation.created']);
    expect(first.items[0]!.details).toMatchObject({
      email: 'new.colleague@frame.example',
      role: 'author',
    });
    const rest = auditPageSchema.parse(
      (await f.call(`/teams/${created.id}/audit?limit=10&offset=1`, f.people.admin)).body,
    );
    expect(rest.items).toHaveLength(2);
    expect(Date.parse(rest.items[0]!.createdAt)).toBeLessThanOrEqual(
      Date.parse(first.items[0]!.createdAt),
    );
  });
});
