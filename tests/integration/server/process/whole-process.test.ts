import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { submissionSchema } from '@shared/api/candidates.ts';
import { acceptedInvitationSchema } from '@shared/api/invitations.ts';
import { logbookSchema } from '@shared/api/logbook.ts';
import { mailboxMessageSchema, mailboxPageSchema } from '@shared/api/mailbox.ts';
import { matrixSetDetailSchema } from '@shared/api/matrix-sets.ts';
import { meSchema } from '@shared/api/me.ts';
import { promotionOutcomeSchema } from '@shared/api/promotions.ts';
import { reviewOutcomeSchema } from '@shared/api/reviews.ts';
import { routineDetailSchema } from '@shared/api/routines.ts';
import { teamDetailSchema } from '@shared/api/teams.ts';
import { createdApiTokenSchema } from '@shared/api/tokens.ts';
import { trialDetailSchema } from '@shared/api/trials.ts';
import { parseWithNonFinite } from '@shared/json-numbers.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { readAnswer, type ApiAnswer } from '@tests/helpers/team-fixture.ts';
import { createFreshDatabase, signInAs, type CookieJar } from '../auth/oauth-flow.ts';
import { waitFor } from '../jobs/job-world.ts';
import { startProcessWorld, type ProcessWorld } from './process-world.ts';

// The review process of product.md ("The flows that must work end to end") through the API
// alone: three people sign in through the fake provider's redirects, the first (an instance
// admin on a fresh database) creates the team, its maintainer invites the others by e-mail,
// the author submits a sound kernel with an API token, the worker runs the trial, a reviewer
// signs off, the maintainer promotes, and the captured mailbox holds what each person was sent.

const [authorIdentity, reviewerIdentity, maintainerIdentity] = demoIdentities;
const soundKernel = readFileSync(
  path.resolve('sandbox/kernels/examples/lu-partial-pivoting-right-looking.ts'),
  'utf8',
);

interface Person {
  login: string;
  email: string;
  jar: CookieJar;
}

describe('the whole review process through the API', () => {
  let fresh: { url: string; drop: () => Promise<void> };
  let world: ProcessWorld;

  beforeAll(async () => {
    fresh = await createFreshDatabase(inject('databaseUrl'));
    world = await startProcessWorld(fresh.url);
  });

  afterAll(async () => {
    await world?.close();
    await fresh?.drop();
  });

  /** A JSON request as a signed-in person: their session cookie, from the app's own origin. */
  const asPerson = async (
    person: Person,
    route: string,
    method = 'GET',
    body?: unknown,
  ): Promise<ApiAnswer> =>
    readAnswer(
      await fetch(`${world.app.url}/api${route}`, {
        method,
        headers: {
          cookie: person.jar.header(),
          origin: world.app.url,
          'content-type': 'application/json',
        },
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      }),
    );

  /** A JSON request with an API token, as the command line and CI send them. */
  const withToken = async (token: string, route: string, method = 'GET', body?: unknown) => {
    const res = await fetch(`${world.app.url}/api${route}`, {
      method,
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
    });
    return { status: res.status, body: parseWithNonFinite(await res.text()) };
  };

  const expectStatus = (answer: { status: number; body: unknown }, status: number) =>
    expect(answer.status, JSON.stringify(answer.body)).toBe(status);

  /** Every message the fake SMTP server holds, read through the development mailbox. */
  const mailbox = async () => {
    const res = await fetch(`${world.app.url}/api/dev/mailbox?limit=100`);
    expect(res.status).toBe(200);
    return mailboxPageSchema.parse(await res.json()).items;
  };
  const mailCount = (n: number) =>
    waitFor(async () => {
      const items = await mailbox();
      return items.length >= n ? items : null;
    }, `${n} messages in the mailbox`);

  const signIn = async (identity: (typeof demoIdentities)[number]): Promise<Person> => {
    const trace = await signInAs(world, identity.login);
    expect(trace.landing).toBe('/');
    return { login: identity.login, email: identity.email, jar: trace.jar };
  };

  it('goes from sign-in to a promotion, with the right e-mail to the right people', async () => {
    // Sign-in: the first person on a fresh instance becomes its admin; the others do not.
    const author = await signIn(authorIdentity!);
    const reviewer = await signIn(reviewerIdentity!);
    const maintainer = await signIn(maintainerIdentity!);
    const meOf = async (p: Person) => meSchema.parse((await asPerson(p, '/me')).body);
    expect((await meOf(author)).user).toMatchObject({ login: author.login, isAdmin: true });
    expect((await meOf(reviewer)).user.isAdmin).toBe(false);
    expect((await meOf(maintainer)).user.isAdmin).toBe(false);

    // The admin creates the team with the maintainer as its first maintainer.
    const created = await asPerson(author, '/teams', 'POST', {
      name: 'Hallbrook & Vey Frame Analysis',
      slug: 'frame-analysis',
      maintainerLogin: maintainer.login,
    });
    expectStatus(created, 201);
    const team = teamDetailSchema.parse(created.body);
    expect(team.myRole).toBeNull();

    // The maintainer invites the author and the reviewer; each accepts the link in their mail.
    for (const [person, role] of [
      [author, 'author'],
      [reviewer, 'reviewer'],
    ] as const) {
      const invited = await asPerson(maintainer, `/teams/${team.id}/invitations`, 'POST', {
        email: person.email,
        role,
      });
      expectStatus(invited, 201);
    }
    const invitations = await mailCount(2);
    for (const [person, role] of [
      [author, 'author'],
      [reviewer, 'reviewer'],
    ] as const) {
      const summary = invitations.find((m) => m.to.includes(person.email));
      expect(summary?.subject).toContain('invites you to the team Hallbrook & Vey Frame Analysis');
      const message = mailboxMessageSchema.parse(
        await (await fetch(`${world.app.url}/api/dev/mailbox/${summary!.id}`)).json(),
      );
      const link = new RegExp(`${world.app.url}/invitations/([^\\s"<]+)`).exec(message.text);
      expect(link, message.text).not.toBeNull();
      const accepted = await asPerson(person, '/invitations/accept', 'POST', {
        token: decodeURIComponent(link![1]!),
      });
      expectStatus(accepted, 200);
      expect(acceptedInvitationSchema.parse(accepted.body)).toMatchObject({
        role,
        outcome: 'joined',
      });
    }
    const myTeams = (await meOf(author)).teams;
    expect(myTeams).toEqual([expect.objectContaining({ slug: 'frame-analysis', role: 'author' })]);

    // The maintainer sets up a matrix set and an LU routine on it.
    const set = await asPerson(maintainer, `/teams/${team.id}/matrix-sets`, 'POST', {
      name: 'Frame quick set',
      timingSizes: [16],
      items: [
        { kind: 'generated', family: 'uniform', n: 8, seed: 1 },
        { kind: 'generated', family: 'hilbert', n: 6 },
        { kind: 'generated', family: 'singular', n: 6 },
      ],
    });
    expectStatus(set, 201);
    const routineAnswer = await asPerson(maintainer, `/teams/${team.id}/routines`, 'POST', {
      slug: 'dense-lu',
      title: 'Dense LU for frame stiffness',
      contract: 'lu-partial-pivoting',
      matrixSetId: matrixSetDetailSchema.parse(set.body).id,
    });
    expectStatus(routineAnswer, 201);
    const routine = routineDetailSchema.parse(routineAnswer.body);
    expect(routine.incumbent).toBeNull();

    // The author makes an API token (shown once) and submits with it, as the command line does.
    const tokenAnswer = await asPerson(author, '/tokens', 'POST', { name: 'laptop' });
    expectStatus(tokenAnswer, 201);
    const { token } = createdApiTokenSchema.parse(tokenAnswer.body);
    const submitted = await withToken(token, `/routines/${routine.id}/candidates`, 'POST', {
      title: 'Right-looking LU with contiguous rows',
      source: soundKernel,
    });
    expectStatus(submitted, 201);
    const submission = submissionSchema.parse(submitted.body);
    expect(submission.candidate.state).toBe('on-trial');
    expect(submission.revision.errorCount).toBe(0);
    const candidateId = submission.candidate.id;

    // The worker runs the trial; the candidate goes to review.
    const trial = await waitFor(async () => {
      const answer = await withToken(token, `/trials/${submission.trial!.id}`);
      const detail = trialDetailSchema.parse(answer.body);
      return detail.status === 'queued' || detail.status === 'running' ? null : detail;
    }, 'the trial to finish');
    expect(trial.status).toBe('completed');
    expect(trial.passed).toBe(true);
    expect(trial.matrices.map((m) => m.id)).toEqual(['uniform-n8-s1', 'hilbert-n6', 'singular-n6']);
    const inReview = await withToken(token, `/candidates/${candidateId}`);
    expect((inReview.body as { state: string }).state).toBe('in-review');

    // The author may not judge their own candidate; the reviewer signs off and it is cleared.
    const ownVerdict = await asPerson(author, `/candidates/${candidateId}/reviews`, 'POST', {
      verdict: 'sign-off',
    });
    expectStatus(ownVerdict, 403);
    const signedOff = await asPerson(reviewer, `/candidates/${candidateId}/reviews`, 'POST', {
      verdict: 'sign-off',
      body: 'Factor ratios well inside the threshold; the singular matrix is rejected.',
    });
    expectStatus(signedOff, 201);
    expect(reviewOutcomeSchema.parse(signedOff.body)).toMatchObject({
      candidateState: 'cleared',
      signOffs: 1,
      signOffsRequired: 1,
    });

    // Only the maintainer promotes.
    const byReviewer = await asPerson(reviewer, `/candidates/${candidateId}/promote`, 'POST', {});
    expectStatus(byReviewer, 403);
    const promoted = await asPerson(maintainer, `/candidates/${candidateId}/promote`, 'POST', {
      note: 'First incumbent of the frame routine.',
    });
    expectStatus(promoted, 201);
    const outcome = promotionOutcomeSchema.parse(promoted.body);
    expect(outcome.caution).not.toBe('');

    // The logbook shows the promotion and the tenure it began.
    const logbookAnswer = await asPerson(reviewer, `/routines/${routine.id}/logbook`);
    expectStatus(logbookAnswer, 200);
    const logbook = logbookSchema.parse(logbookAnswer.body);
    expect(logbook.routine.incumbentRevisionId).toBe(submission.revision.id);
    expect(logbook.promotions).toHaveLength(1);
    expect(logbook.promotions[0]).toMatchObject({
      id: outcome.promotion.id,
      kind: 'promote',
      candidateId,
      revisionId: submission.revision.id,
      trialId: trial.id,
      previousRevisionId: null,
      note: 'First incumbent of the frame routine.',
      promotedBy: expect.objectContaining({ login: maintainer.login }),
    });
    expect(logbook.tenures).toEqual([
      expect.objectContaining({ promotionId: outcome.promotion.id, trialId: trial.id, to: null }),
    ]);

    // The mailbox: two invitations, "awaits review" to the reviewer (not the author, not the
    // maintainer), "signed off" to the author, "cleared" to the maintainer, "promoted" to all
    // three members. Nothing else, to no one else.
    const expected = [
      ['invites you to the team', author.email],
      ['invites you to the team', reviewer.email],
      ['Awaits review: Right-looking LU with contiguous rows', reviewer.email],
      ['Signed off: Right-looking LU with contiguous rows', author.email],
      ['Cleared: Right-looking LU with contiguous rows', maintainer.email],
      ['Promoted: Right-looking LU with contiguous rows', author.email],
      ['Promoted: Right-looking LU with contiguous rows', reviewer.email],
      ['Promoted: Right-looking LU with contiguous rows', maintainer.email],
    ] as const;
    const messages = await mailCount(expected.length);
    expect(messages).toHaveLength(expected.length);
    for (const [subject, to] of expected) {
      expect(
        messages.filter((m) => m.subject.includes(subject) && m.to.length === 1 && m.to[0] === to),
        `${subject} → ${to}`,
      ).toHaveLength(1);
    }
    // The notification links to the candidate's page on this app (with or without the team's
    // prefix that the client's own paths use).
    const cleared = messages.find((m) => m.subject.startsWith('Cleared:'))!;
    const clearedText = mailboxMessageSchema.parse(
      await (await fetch(`${world.app.url}/api/dev/mailbox/${cleared.id}`)).json(),
    ).text;
    expect(clearedText).toMatch(
      new RegExp(`${world.app.url}/(teams/frame-analysis/)?candidates/${candidateId}\\b`),
    );
  });
});
