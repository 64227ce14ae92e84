import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { promotionOutcomeSchema } from '@shared/api/promotions.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { routines } from '@server/db/schema/routines.ts';
import {
  addressOf,
  call,
  startReviewWorld,
  type ReviewWorld,
} from '@tests/integration/server/candidates/review-world.ts';
import {
  seedCandidate,
  seedPromotionHistory,
} from '@tests/integration/server/candidates/seed-candidates.ts';

let world: ReviewWorld;
beforeAll(async () => {
  world = await startReviewWorld(inject('databaseUrl'));
});
afterAll(() => world.close());

async function incumbentOf(routineId: number) {
  const [row] = await world.db.select().from(routines).where(eq(routines.id, routineId));
  return row!.incumbentRevisionId;
}

describe('promoting', () => {
  it('refuses a candidate that is not cleared, with 409', async () => {
    const { author, maintainer } = world.people;
    for (const state of ['in-review', 'on-trial', 'returned', 'promoted'] as const) {
      const seeded = await seedCandidate(world.db, world.routine, author.id, state);
      const res = await call(
        world.api(`/candidates/${seeded.candidateId}/promote`),
        maintainer,
        'POST',
        {},
      );
      expect(res.status).toBe(409);
      expect(apiErrorSchema.parse(res.body).error.message).toContain('Only a cleared candidate');
    }
  });

  it('refuses a cleared candidate that no longer meets a raised bar', async () => {
    const { author, reviewer, maintainer } = world.people;
    const routine = await world.addRoutine({ signOffsRequired: 1 });
    const seeded = await seedCandidate(world.db, routine, author.id, 'cleared', [reviewer.id]);
    await world.db
      .update(routines)
      .set({ policy: { ...routine.policy, signOffsRequired: 2 } })
      .where(eq(routines.id, routine.id));
    const res = await call(
      world.api(`/candidates/${seeded.candidateId}/promote`),
      maintainer,
      'POST',
      {
        note: 'now',
      },
    );
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error.message).toContain('1 more sign-off on revision 1');
    expect(await incumbentOf(routine.id)).toBeNull();
  });

  it('makes the latest revision the incumbent, recording the one it replaces', async () => {
    const { author, reviewer, maintainer } = world.people;
    const routine = await world.addRoutine();
    const history = await seedPromotionHistory(world.db, routine, author.id, maintainer.id);
    const before = await incumbentOf(routine.id);
    const seeded = await seedCandidate(world.db, routine, author.id, 'cleared', [reviewer.id]);
    const res = await call(
      world.api(`/candidates/${seeded.candidateId}/promote`),
      maintainer,
      'POST',
      {},
    );
    expect(res.status).toBe(201);
    const { promotion } = promotionOutcomeSchema.parse(res.body);
    expect(promotion).toMatchObject({
      kind: 'promote',
      revisionId: seeded.revisionId,
      trialId: seeded.trialId,
      previousRevisionId: before,
      note: '',
    });
    expect(promotion.metricsSnapshot.timing).toEqual([]);
    expect(promotion.id).toBeGreaterThan(history.second);
    expect(await incumbentOf(routine.id)).toBe(seeded.revisionId);
  });
});

describe('reinstating', () => {
  it('restores an earlier incumbent the same way, and tells the team', async () => {
    const { author, maintainer, reviewer, secondReviewer } = world.people;
    const routine = await world.addRoutine();
    const { first, second } = await seedPromotionHistory(
      world.db,
      routine,
      author.id,
      maintainer.id,
    );
    const current = await incumbentOf(routine.id);
    const url = world.api(`/routines/${routine.id}/reinstate`);

    const res = await call(url, maintainer, 'POST', {
      promotionId: first,
      note: 'Slowdown on the new runtime; back to the first kernel.',
    });
    expect(res.status).toBe(201);
    const outcome = promotionOutcomeSchema.parse(res.body);
    expect(outcome.caution).toContain('qualified engineers');
    expect(outcome.promotion).toMatchObject({
      kind: 'reinstate',
      previousRevisionId: current,
      metricsSnapshot: { worstFactorRatio: 1.7, worstForwardErrorOverBound: 0.2, timing: [] },
    });
    expect(await incumbentOf(routine.id)).toBe(outcome.promotion.revisionId);
    expect(outcome.promotion.revisionId).not.toBe(current);

    const mail = await world.db
      .select()
      .from(emailOutbox)
      .where(
        and(
          eq(emailOutbox.kind, 'reinstated'),
          inArray(emailOutbox.toAddress, Object.values(world.people).map(addressOf)),
        ),
      );
    expect(mail.map((m) => m.toAddress).sort()).toEqual(
      [author, reviewer, secondReviewer, maintainer].map(addressOf).sort(),
    );
    expect(mail[0]!.textBody).toContain('Slowdown on the new runtime');

    // The revision it restored is the incumbent now: reinstating it again is a conflict.
    expect((await call(url, maintainer, 'POST', { promotionId: first })).status).toBe(409);
    // The other one can come back.
    expect((await call(url, maintainer, 'POST', { promotionId: second })).status).toBe(201);
  });

  it('answers 404 for a promotion of another routine and 400 for a missing or string id', async () => {
    const { author, maintainer } = world.people;
    const one = await world.addRoutine();
    const other = await world.addRoutine();
    const { first } = await seedPromotionHistory(world.db, other, author.id, maintainer.id);
    const url = world.api(`/routines/${one.id}/reinstate`);
    expect((await call(url, maintainer, 'POST', { promotionId: first })).status).toBe(404);
    expect((await call(url, maintainer, 'POST', { promotionId: 99_999_999 })).status).toBe(404);
    expect((await call(url, maintainer, 'POST', { note: 'no id' })).status).toBe(400);
    expect((await call(url, maintainer, 'POST', { promotionId: String(first) })).status).toBe(400);
  });
});
