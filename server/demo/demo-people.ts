import { eq } from 'drizzle-orm';
import { createTeamSchema } from '@shared/api/teams.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { signInWithGithub } from '@server/auth/sign-in.service.ts';
import type { Db } from '@server/db/client.ts';
import { users } from '@server/db/schema/users.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { insertMembership } from '@server/members/members.repo.ts';
import { createTeam } from '@server/teams/teams.service.ts';
import { demoTeam } from './demo-team.ts';

export interface DemoPeople {
  teamId: number;
  /** Each demo person as the services see a signed-in user, by login. */
  byLogin: Map<string, CurrentUser>;
}

/** The demo person with this login; a story naming someone else is a programming error. */
export function person(people: DemoPeople, login: string): CurrentUser {
  const user = people.byLogin.get(login);
  if (!user) throw new Error(`the demo story names ${login}, who is not in the demo team`);
  return user;
}

/**
 * Records the five people as if each had signed in through the fake provider (same GitHub ids,
 * stored as String(id), so signing in later finds them), makes the team's admin an instance
 * admin, creates the team with its maintainer and adds the others with their roles, audited as
 * the admin's doing.
 */
export async function createDemoPeople(db: Db): Promise<DemoPeople> {
  const byLogin = new Map<string, CurrentUser>();
  for (const identity of demoIdentities) {
    const user = await signInWithGithub(db, {
      githubId: String(identity.id),
      login: identity.login,
      name: identity.name,
      email: identity.email,
    });
    if (!user) throw new Error(`the login ${identity.login} belongs to another account`);
    byLogin.set(user.login, user);
  }
  const admin = byLogin.get(demoTeam.admin)!;
  if (!admin.isAdmin) {
    await db.update(users).set({ isAdmin: true }).where(eq(users.id, admin.id));
    byLogin.set(admin.login, { ...admin, isAdmin: true });
  }
  const team = await createTeam(
    db,
    byLogin.get(demoTeam.admin)!,
    createTeamSchema.parse({
      name: demoTeam.name,
      slug: demoTeam.slug,
      maintainerLogin: demoTeam.maintainer,
    }),
  );
  for (const member of demoTeam.members) {
    const user = byLogin.get(member.login);
    if (!user) throw new Error(`the demo team names ${member.login}, who has no identity`);
    await insertMembership(db, { teamId: team.id, userId: user.id, role: member.role });
    await recordAudit(db, {
      actorId: admin.id,
      teamId: team.id,
      action: 'member.added',
      entity: 'member',
      entityId: user.id,
      details: { login: user.login, role: member.role },
    });
  }
  return { teamId: team.id, byLogin };
}
