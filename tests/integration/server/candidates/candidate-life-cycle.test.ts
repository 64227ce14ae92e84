import { createHash } from 'node:crypto';
import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import {
  candidateDetailSchema,
  candidatePageSchema,
  submissionSchema,
} from '@shared/api/candidates.ts';
import { logbookSchema } from '@shared/api/logbook.ts';
import { promotionOutcomeSchema } from '@shared/api/promotions.ts';
import { reviewOutcomeSchema } from '@shared/api/reviews.ts';
import { loadEnv } from '@server/config/env.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { routines } from '@server/db/schema/routines.ts';
import { addressOf, call, goodKernel, startReviewWorld, type ReviewWorld } from './review-world.ts';
import { finishTrial } from './simulated-worker.ts';

let world: ReviewWorld;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

async function outbox(kind: string) {
  const rows = await world.db
    .select()
    .from(emailOutbox)
    .where(
      and(
        eq(emailOutbox.kind, kind),
        inArray(emailOutbox.toAddress, Object.values(world.people).map(addressOf)),
      ),
    );
  return rows;
}

describe('a candidate from submission to promotion', () => {
  it('goes on trial, into review, is cleared and promoted, with audit and e-mail', async () => {
    const { author, reviewer, secondReviewer, maintainer } = world.people;
    const routineId = world.routine.id;

    // Submit: revision 1, immutable source with its hash, a queued trial on the queue.
    const submitted = await call(world.api(`/routines/${routineId}/candidates`), author, 'POST', {
      title: 'Right-looking LU for the frame solver',
      description: 'Row exchanges done in place.',
      source: goodKernel,
    });
    expect(submitted.status).toBe(201);
    const submission = submissionSchema.parse(submitted.body);
    expect(submission.candidate.state).toBe('on-trial');
    expect(submission.revision.number).toBe(1);
    expect(submission.revision.diagnostics).toEqual([]);
    expect(submission.revision.sourceHash).toBe(
      createHash('sha256').update(goodKernel).digest('hex'),
    );
    const trial = submission.trial!;
    expect(trial).toMatchObject({
      status: 'queued',
      progress: { phase: 'queued', done: 0, total: 0 },
      incumbentRevisionId: null,
      matrixSetId: world.routine.matrixSetId,
    });
    expect(world.queue.enqueued).toContain(trial.id);
    const candidateId = submission.candidate.id;
    const candidateUrl = world.api(`/candidates/${candidateId}`);

    // No verdict while the trial runs.
    const early = await call(`${candidateUrl}/reviews`, reviewer, 'POST', { verdict: 'sign-off' });
    expect(early.status).toBe(409);

    // The worker finishes the trial: in review, and the reviewers (only) hear of it.
    const env = loadEnv({ PUBLIC_URL: world.app.url });
    expect((await finishTrial(world.db, env, trial.id, true)).length).toBe(2);
    const awaiting = await outbox('awaits-review');
    expect(awaiting.map((r) => r.toAddress).sort()).toEqual(
      [addressOf(reviewer), addressOf(secondReviewer)].sort(),
    );
    expect(awaiting[0]!.textBody).toContain(`/candidates/${candidateId}`);

    let detail = candidateDetailSchema.parse((await call(candidateUrl, reviewer)).body);
    expect(detail.state).toBe('in-review');
    expect(detail.clearance).toMatchObject({ trialPassed: true, signOffs: 0, signOffsRequired: 1 });
    expect(detail.clearance.stillNeeded).toEqual(['1 more sign-off on revision 1']);
    expect(detail.permissions).toMatchObject({ review: true, promote: false, revise: false });

    // The author may not judge their own candidate.
    const own = await call(`${candidateUrl}/reviews`, author, 'POST', { verdict: 'sign-off' });
    expect(own.status).toBe(403);
    expect(JSON.stringify(own.body)).toContain('your own candidate');

    // A reviewer signs off: cleared; the author and the maintainers hear of it.
    const signed = await call(`${candidateUrl}/reviews`, reviewer, 'POST', {
      verdict: 'sign-off',
      body: 'Accuracy matches the incumbent; faster at n = 64.',
    });
    expect(signed.status).toBe(201);
    expect(reviewOutcomeSchema.parse(signed.body)).toMatchObject({
      candidateState: 'cleared',
      signOffs: 1,
      signOffsRequired: 1,
    });
    expect((await outbox('signed-off')).map((r) => r.toAddress)).toEqual([addressOf(author)]);
    expect((await outbox('cleared')).map((r) => r.toAddress)).toEqual([addressOf(maintainer)]);

    const cleared = await call(world.api(`/routines/${routineId}/cleared`), maintainer);
    expect(candidatePageSchema.parse(cleared.body).items.map((c) => c.id)).toEqual([candidateId]);

    // A maintainer promotes it: the incumbent changes, with a record and the caution.
    const promoted = await call(`${candidateUrl}/promote`, maintainer, 'POST', {
      note: 'Verified against our own frame cases.',
    });
    expect(promoted.status).toBe(201);
    const outcome = promotionOutcomeSchema.parse(promoted.body);
    expect(outcome.caution).toContain('evidence, not certification');
    expect(outcome.promotion).toMatchObject({
      kind: 'promote',
      revisionId: submission.revision.id,
      trialId: trial.id,
      previousRevisionId: null,
      promotedBy: { id: maintainer.id },
      note: 'Verified against our own frame cases.',
      metricsSnapshot: {
        worstFactorRatio: 1.7,
        worstForwardErrorOverBound: 0.2,
        timing: [{ n: 64, medianMs: 0.48, gflops: 0.36 }],
      },
    });
    const [routine] = await world.db.select().from(routines).where(eq(routines.id, routineId));
    expect(routine!.incumbentRevisionId).toBe(submission.revision.id);
    detail = candidateDetailSchema.parse((await call(candidateUrl, author)).body);
    expect(detail.state).toBe('promoted');

    // The logbook shows the promotion and the open tenure.
    const logbook = logbookSchema.parse(
      (await call(world.api(`/routines/${routineId}/logbook`), author)).body,
    );
    expect(logbook.promotions.map((p) => p.id)).toEqual([outcome.promotion.id]);
    expect(logbook.tenures).toEqual([
      expect.objectContaining({ revisionId: submission.revision.id, trialId: trial.id, to: null }),
    ]);
    expect(logbook.routine.incumbentRevisionId).toBe(submission.revision.id);

    // The whole team hears of the promotion, nobody outside it.
    const team = [author, reviewer, secondReviewer, maintainer].map(addressOf).sort();
    const promotedMail = await outbox('promoted');
    expect(promotedMail.map((r) => r.toAddress).sort()).toEqual(team);
    expect(promotedMail[0]!.textBody).toContain('evidence, not certification');

    // Every state change is in the audit log.
    const audit = await world.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'candidate'), eq(auditLog.entityId, candidateId)))
      .orderBy(auditLog.id);
    expect(audit.map((a) => a.action)).toEqual([
      'candidate.submitted',
      'candidate.cleared',
      'candidate.promoted',
    ]);
    expect(audit[0]).toMatchObject({ actorId: author.id, teamId: world.team.id });
  });
});
