import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { candidateDetailSchema, submissionSchema } from '@shared/api/candidates.ts';
import { reviewOutcomeSchema } from '@shared/api/reviews.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { loadEnv, type Env } from '@server/config/env.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import type { TestUser } from '@tests/helpers/users.ts';
import {
  addressOf,
  call,
  goodKernel,
  startReviewWorld,
  type ReviewWorld,
  type RoutineRow,
} from '@tests/integration/server/candidates/review-world.ts';
import { finishTrial } from '@tests/integration/server/candidates/simulated-worker.ts';

let world: ReviewWorld;
let env: Env;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
  env = loadEnv({ PUBLIC_URL: world.app.url });
});
afterAll(() => world.close());

/** A candidate by `author`, submitted through the API and brought into review by the worker. */
async function inReview(author: TestUser, routine: RoutineRow = world.routine, passed = true) {
  const res = await call(world.api(`/routines/${routine.id}/candidates`), author, 'POST', {
    title: 'Crout-ordered LU',
    source: goodKernel,
  });
  const submission = submissionSchema.parse(res.body);
  await finishTrial(world.db, env, submission.trial!.id, passed);
  return submission.candidate.id;
}

const review = (id: number, user: TestUser, body: unknown) =>
  call(world.api(`/candidates/${id}/reviews`), user, 'POST', body);
const detail = async (id: number, user: TestUser) =>
  candidateDetailSchema.parse((await call(world.api(`/candidates/${id}`), user)).body);

describe('sending back', () => {
  it('needs a reason', async () => {
    const id = await inReview(world.people.author);
    for (const body of [{ verdict: 'send-back' }, { verdict: 'send-back', body: '  ' }]) {
      const res = await review(id, world.people.reviewer, body);
      expect(res.status).toBe(400);
      expect(JSON.stringify(apiErrorSchema.parse(res.body).error.details)).toContain('body');
    }
    expect((await review(id, world.people.reviewer, { verdict: 'maybe' })).status).toBe(400);
    expect((await detail(id, world.people.author)).state).toBe('in-review');
  });

  it('returns the candidate to its author with the reason; a new revision goes on trial', async () => {
    const { author, reviewer } = world.people;
    const id = await inReview(author);
    const reason = 'Growth factor 2.5 on the frame matrix; the incumbent stays at 1.';
    const res = await review(id, reviewer, { verdict: 'send-back', body: reason });
    expect(res.status).toBe(201);
    expect(reviewOutcomeSchema.parse(res.body).candidateState).toBe('returned');

    const mail = await world.db
      .select()
      .from(emailOutbox)
      .where(
        and(eq(emailOutbox.kind, 'sent-back'), inArray(emailOutbox.toAddress, [addressOf(author)])),
      );
    expect(mail).toHaveLength(1);
    expect(mail[0]!.textBody).toContain(reason);
    const [audit] = await world.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, id), eq(auditLog.action, 'candidate.sent-back')));
    expect(audit).toMatchObject({ actorId: reviewer.id, entity: 'candidate' });

    expect((await review(id, world.people.secondReviewer, { verdict: 'sign-off' })).status).toBe(
      409,
    );
    const revised = await call(world.api(`/candidates/${id}/revisions`), author, 'POST', {
      source: `${goodKernel}\n// growth checked\n`,
    });
    expect(submissionSchema.parse(revised.body).candidate.state).toBe('on-trial');
  });
});

describe('signing off', () => {
  it('is never done by the author, whatever their role', async () => {
    const { reviewer, author } = world.people;
    const own = await inReview(reviewer);
    const res = await review(own, reviewer, { verdict: 'sign-off' });
    expect(res.status).toBe(403);
    expect(apiErrorSchema.parse(res.body).error.message).toBe(
      'You cannot sign off or send back your own candidate; another reviewer must.',
    );
    const byAuthorRole = await review(own, author, { verdict: 'sign-off' });
    expect(byAuthorRole.status).toBe(403);
    expect(apiErrorSchema.parse(byAuthorRole.body).error.message).toContain(
      'reviewers and maintainers',
    );
  });

  it('counts distinct reviewers on the latest revision only', async () => {
    const { author, reviewer, secondReviewer, maintainer } = world.people;
    const strict = await world.addRoutine({ signOffsRequired: 2 });
    const id = await inReview(author, strict);

    const one = reviewOutcomeSchema.parse(
      (await review(id, reviewer, { verdict: 'sign-off' })).body,
    );
    expect(one).toMatchObject({ candidateState: 'in-review', signOffs: 1, signOffsRequired: 2 });
    // A sign-off that moves nothing is still in the audit log, under the reviewer's name.
    const [signOffAudit] = await world.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'review'), eq(auditLog.entityId, one.review.id)));
    expect(signOffAudit).toMatchObject({
      action: 'review.signed-off',
      actorId: reviewer.id,
      teamId: world.team.id,
      details: { candidateId: id, revision: 1 },
    });
    expect((await review(id, reviewer, { verdict: 'sign-off' })).status).toBe(409);

    // Revision 2 starts the count afresh.
    const revised = await call(world.api(`/candidates/${id}/revisions`), author, 'POST', {
      source: `${goodKernel}\n// revision 2\n`,
    });
    await finishTrial(world.db, env, submissionSchema.parse(revised.body).trial!.id);
    const fresh = await detail(id, author);
    expect(fresh.clearance).toMatchObject({ signOffs: 0, signOffsRequired: 2 });
    expect(fresh.clearance.stillNeeded).toEqual(['2 more sign-offs on revision 2']);

    await review(id, reviewer, { verdict: 'sign-off' });
    const two = reviewOutcomeSchema.parse(
      (await review(id, secondReviewer, { verdict: 'sign-off', body: 'Timing holds up.' })).body,
    );
    expect(two).toMatchObject({ candidateState: 'cleared', signOffs: 2 });
    // A maintainer may add a verdict to a cleared candidate; it stays cleared.
    const third = await review(id, maintainer, { verdict: 'sign-off' });
    expect(reviewOutcomeSchema.parse(third.body)).toMatchObject({
      candidateState: 'cleared',
      signOffs: 3,
    });
    expect((await detail(id, author)).reviews.map((r) => r.revisionNumber)).toEqual([1, 2, 2, 2]);
  });

  it('does not clear a candidate whose trial failed the acceptance policy', async () => {
    const id = await inReview(world.people.author, world.routine, false);
    const res = await review(id, world.people.reviewer, { verdict: 'sign-off' });
    expect(reviewOutcomeSchema.parse(res.body).candidateState).toBe('in-review');
    const { clearance } = await detail(id, world.people.author);
    expect(clearance.trialPassed).toBe(false);
    expect(clearance.stillNeeded).toEqual([
      'a trial that passes the acceptance policy (revision 1 did not)',
    ]);
  });

  it('a cleared candidate can still be sent back', async () => {
    const id = await inReview(world.people.author);
    await review(id, world.people.reviewer, { verdict: 'sign-off' });
    expect((await detail(id, world.people.author)).state).toBe('cleared');
    const back = await review(id, world.people.secondReviewer, {
      verdict: 'send-back',
      body: 'Second look: the 12×12 upload needs a pivoting note.',
    });
    expect(reviewOutcomeSchema.parse(back.body).candidateState).toBe('returned');
  });
});
