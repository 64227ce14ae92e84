import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  acceptedInvitationSchema,
  invitationPageSchema,
  invitationSchema,
} from '@shared/api/invitations.ts';
import { hashSecret } from '@server/auth/api-token-secret.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { invitations } from '@server/db/schema/invitations.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import {
  createTeamWorld,
  startTeamFixture,
  type TeamFixture,
} from '@tests/helpers/team-fixture.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';

let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(() => f.close());

let counter = 0;
const newAddress = () => `engineer-${Date.now()}-${++counter}@frame.example`;

/** Invites an address and returns the invitation with the secret read from its e-mail. */
async function invite(teamId: number, by: TestUser, role = 'reviewer', email = newAddress()) {
  const res = await f.call(`/teams/${teamId}/invitations`, by, 'POST', { email, role });
  expect(res.status).toBe(201);
  const invitation = invitationSchema.parse(res.body);
  const [mail] = await f.db
    .select()
    .from(emailOutbox)
    .where(eq(emailOutbox.toAddress, email))
    .orderBy(desc(emailOutbox.id))
    .limit(1);
  const link = new RegExp(`${f.app.url}/invitations/([A-Za-z0-9_-]+)`).exec(mail!.textBody);
  return { invitation, mail: mail!, token: decodeURIComponent(link![1]!) };
}

const roleOf = async (teamId: number, userId: number) => {
  const [row] = await f.db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
  return row?.role ?? null;
};

describe('invitations', () => {
  it('stores only a hash of the secret and e-mails the link through the outbox', async () => {
    const email = newAddress();
    const { invitation, mail, token } = await invite(
      f.team.id,
      f.people.maintainer,
      'reviewer',
      email,
    );
    expect(invitation).toMatchObject({
      email,
      role: 'reviewer',
      status: 'pending',
      teamId: f.team.id,
    });
    const lifetime = Date.parse(invitation.expiresAt) - Date.parse(invitation.createdAt);
    expect(Math.round(lifetime / 3_600_000)).toBe(7 * 24);
    expect(mail).toMatchObject({ kind: 'invitation', toAddress: email, sentAt: null });
    expect(mail.subject).toContain(f.team.name);
    expect(mail.htmlBody).toContain(`${f.app.url}/invitations/${token}`);
    const [row] = await f.db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row!.tokenHash).toBe(hashSecret(token));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(JSON.stringify(invitation)).not.toContain(token);
  });

  it('lists pending invitations only, and revokes one', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const kept = await invite(team.id, people.maintainer, 'author');
    const dropped = await invite(team.id, people.admin, 'maintainer');
    const revoked = await f.call(
      `/teams/${team.id}/invitations/${dropped.invitation.id}`,
      people.maintainer,
      'DELETE',
    );
    expect(revoked.status).toBe(200);
    expect(invitationSchema.parse(revoked.body)).toMatchObject({ status: 'revoked' });

    const page = invitationPageSchema.parse(
      (await f.call(`/teams/${team.id}/invitations`, people.maintainer)).body,
    );
    expect(page.items.map((i) => i.id)).toEqual([kept.invitation.id]);
    expect(page.items[0]!.invitedBy).toEqual({
      id: people.maintainer.id,
      login: people.maintainer.login,
    });

    const accept = await f.call('/invitations/accept', people.outsider, 'POST', {
      token: dropped.token,
    });
    expect(accept.status).toBe(409);
    expect(accept.body).toMatchObject({
      error: { code: 'conflict', message: expect.stringMatching(/revoked/) },
    });
    expect(await roleOf(team.id, people.outsider.id)).toBeNull();

    const actions = await f.db.select().from(auditLog).where(eq(auditLog.teamId, team.id));
    expect(actions.map((a) => a.action).sort()).toEqual([
      'invitation.created',
      'invitation.created',
      'invitation.revoked',
    ]);
    expect(JSON.stringify(actions)).not.toContain(kept.token);
  });

  it('makes whoever accepts a member with the role, once', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const { invitation, token } = await invite(team.id, people.maintainer, 'reviewer');
    const newcomer = await createTestUser(f.db);
    const res = await f.call('/invitations/accept', newcomer, 'POST', { token });
    expect(res.status).toBe(200);
    expect(acceptedInvitationSchema.parse(res.body)).toMatchObject({
      team: { id: team.id, slug: team.slug },
      role: 'reviewer',
      outcome: 'joined',
    });
    expect(await roleOf(team.id, newcomer.id)).toBe('reviewer');
    const [row] = await f.db.select().from(invitations).where(eq(invitations.id, invitation.id));
    expect(row).toMatchObject({ acceptedBy: newcomer.id });
    expect(row!.acceptedAt).toBeInstanceOf(Date);

    const again = await f.call('/invitations/accept', people.outsider, 'POST', { token });
    expect(again.status).toBe(409);
    expect(again.body).toMatchObject({ error: { message: expect.stringMatching(/used already/) } });
    expect(await roleOf(team.id, people.outsider.id)).toBeNull();

    const audit = await f.db.select().from(auditLog).where(eq(auditLog.teamId, team.id));
    expect(audit.map((a) => [a.action, a.actorId])).toEqual(
      expect.arrayContaining([
        ['member.added', newcomer.id],
        ['invitation.accepted', newcomer.id],
      ]),
    );
  });

  it('keeps the higher role for someone already in the team, and says so', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const lower = await invite(team.id, people.maintainer, 'author');
    const kept = acceptedInvitationSchema.parse(
      (await f.call('/invitations/accept', people.reviewer, 'POST', { token: lower.token })).body,
    );
    expect(kept).toMatchObject({ role: 'reviewer', outcome: 'role-kept' });
    expect(kept.message).toMatch(/already reviewer/);
    expect(await roleOf(team.id, people.reviewer.id)).toBe('reviewer');

    const higher = await invite(team.id, people.maintainer, 'maintainer');
    const raised = acceptedInvitationSchema.parse(
      (await f.call('/invitations/accept', people.author, 'POST', { token: higher.token })).body,
    );
    expect(raised).toMatchObject({ role: 'maintainer', outcome: 'role-raised' });
    expect(raised.message).toMatch(/already author/);
    expect(await roleOf(team.id, people.author.id)).toBe('maintainer');
  });

  it('refuses an expired link with a clear message and an unknown one with 404', async () => {
    const { team, people } = await createTeamWorld(f.db);
    const { invitation, token } = await invite(team.id, people.maintainer, 'author');
    await f.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 60_000) })
      .where(eq(invitations.id, invitation.id));
    const expired = await f.call('/invitations/accept', people.outsider, 'POST', { token });
    expect(expired.status).toBe(409);
    expect(expired.body).toMatchObject({
      error: { code: 'conflict', message: expect.stringMatching(/expired on/) },
    });
    expect(await roleOf(team.id, people.outsider.id)).toBeNull();
    const listed = invitationPageSchema.parse(
      (await f.call(`/teams/${team.id}/invitations`, people.maintainer)).body,
    );
    expect(listed.items).toEqual([]);

    const unknown = await f.call('/invitations/accept', people.outsider, 'POST', {
      token: 'this-is-not-a-real-invitation-secret',
    });
    expect(unknown.status).toBe(404);
  });

  it('refuses bad bodies with 400 and details', async () => {
    const url = `/teams/${f.team.id}/invitations`;
    const cases = [
      { email: 'not-an-address', role: 'author' },
      { email: 'a@frame.example', role: 'owner' },
      { email: 'a@frame.example', role: 'author', message: 'hi' },
      { email: 17, role: 'author' },
    ];
    for (const body of cases) {
      const res = await f.call(url, f.people.maintainer, 'POST', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body).toMatchObject({
        error: { code: 'validation-failed', details: expect.any(Array) },
      });
    }
    for (const body of [
      {},
      { token: 5 },
      { token: 'short' },
      { token: 'x'.repeat(40), extra: 1 },
    ]) {
      const res = await f.call('/invitations/accept', f.people.author, 'POST', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect(
      (await f.call(`/teams/${f.team.id}/invitations/abc`, f.people.maintainer, 'DELETE')).status,
    ).toBe(400);
    expect(
      (await f.call(`/teams/${f.team.id}/invitations/99999999`, f.people.maintainer, 'DELETE'))
        .status,
    ).toBe(404);
  });

  it('answers 404 for another team’s invitation id, even to a maintainer', async () => {
    const other = await invite(f.otherTeam.id, f.people.outsider, 'author');
    const res = await f.call(
      `/teams/${f.team.id}/invitations/${other.invitation.id}`,
      f.people.maintainer,
      'DELETE',
    );
    expect(res.status).toBe(404);
  });
});
