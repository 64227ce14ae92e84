import { and, eq } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { createDatabase } from '@server/db/client.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { teams } from '@server/db/schema/teams.ts';
import { users } from '@server/db/schema/users.ts';

const { pool, db } = createDatabase(inject('databaseUrl'), 2);
afterAll(() => pool.end());

describe('teams and memberships through Drizzle', () => {
  it('stores a team with a member and reads the role back through a join', async () => {
    const [team] = await db
      .insert(teams)
      .values({ slug: 'frame-solvers', name: 'Frame solvers' })
      .returning();
    const [user] = await db
      .insert(users)
      .values({ githubId: '9001', login: 'ines-probst' })
      .returning();
    expect(team && user).toBeTruthy();
    await db.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'reviewer' });

    const rows = await db
      .select({ team: teams.name, login: users.login, role: memberships.role })
      .from(memberships)
      .innerJoin(teams, eq(teams.id, memberships.teamId))
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(teams.slug, 'frame-solvers'), eq(users.login, 'ines-probst')));
    expect(rows).toEqual([{ team: 'Frame solvers', login: 'ines-probst', role: 'reviewer' }]);
  });

  it('refuses a role outside the enum and a second membership of the same person', async () => {
    const [team] = await db
      .insert(teams)
      .values({ slug: 'gauge-lab', name: 'Gauge lab' })
      .returning();
    const [user] = await db
      .insert(users)
      .values({ githubId: '9002', login: 'tomas-arvid' })
      .returning();
    await expect(
      pool.query('insert into memberships (team_id, user_id, role) values ($1, $2, $3)', [
        team!.id,
        user!.id,
        'owner',
      ]),
    ).rejects.toThrow(/invalid input value for enum team_role/);
    await db.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'author' });
    await expect(
      db.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'maintainer' }),
    ).rejects.toThrow();
  });

  it('removes memberships when their team is deleted', async () => {
    const [team] = await db
      .insert(teams)
      .values({ slug: 'short-lived', name: 'Short lived' })
      .returning();
    const [user] = await db
      .insert(users)
      .values({ githubId: '9003', login: 'mara-lind' })
      .returning();
    await db.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'maintainer' });
    await db.delete(teams).where(eq(teams.id, team!.id));
    const left = await db.select().from(memberships).where(eq(memberships.userId, user!.id));
    expect(left).toHaveLength(0);
  });
});
