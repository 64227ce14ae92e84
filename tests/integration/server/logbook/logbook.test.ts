import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { logbookSchema } from '@shared/api/logbook.ts';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import {
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

describe('the logbook', () => {
  it('shows promotions, tenures and drift checks, each linked to its trial', async () => {
    const { author, maintainer, reviewer } = world.people;
    const routine = await world.addRoutine();
    const { first, second } = await seedPromotionHistory(
      world.db,
      routine,
      author.id,
      maintainer.id,
    );
    const rerun = await seedCandidate(world.db, routine, author.id, 'promoted');
    await world.db.insert(driftChecks).values([
      { routineId: routine.id, promotionId: first, status: 'steady', finishedAt: new Date() },
      {
        routineId: routine.id,
        promotionId: second,
        trialId: rerun.trialId,
        status: 'drifted',
        findings: ['n = 128: 14 % slower than at promotion'],
        summary: 'Slower at n = 128.',
        alertOpen: true,
        finishedAt: new Date(),
      },
      { routineId: routine.id, promotionId: second },
    ]);
    const reinstated = await call(
      world.api(`/routines/${routine.id}/reinstate`),
      maintainer,
      'POST',
      {
        promotionId: first,
        note: 'Back to the steady one.',
      },
    );
    expect(reinstated.status).toBe(201);

    const res = await call(world.api(`/routines/${routine.id}/logbook`), reviewer);
    expect(res.status).toBe(200);
    const logbook = logbookSchema.parse(res.body);
    expect(logbook.promotions.map((p) => [p.id, p.kind])).toEqual([
      [first, 'promote'],
      [second, 'promote'],
      [expect.any(Number), 'reinstate'],
    ]);
    const [t1, t2, t3] = logbook.tenures;
    expect(t1!.to).toBe(t2!.from);
    expect(t2!.to).toBe(t3!.from);
    expect(t3!.to).toBeNull();
    expect(t3!.revisionId).toBe(t1!.revisionId);
    expect(t3!.trialId).toBe(t1!.trialId);
    expect(logbook.routine.incumbentRevisionId).toBe(t1!.revisionId);
    expect(logbook.promotions[2]!.note).toBe('Back to the steady one.');

    expect(logbook.driftChecks).toEqual([
      expect.objectContaining({
        promotionId: first,
        status: 'steady',
        alertOpen: false,
        trialId: null,
      }),
      expect.objectContaining({
        promotionId: second,
        trialId: rerun.trialId,
        status: 'drifted',
        alertOpen: true,
        findings: ['n = 128: 14 % slower than at promotion'],
      }),
      expect.objectContaining({ promotionId: second, status: null, finishedAt: null }),
    ]);
  });

  it('is empty for a routine without promotions, and hidden from other teams', async () => {
    const routine = await world.addRoutine();
    const own = logbookSchema.parse(
      (await call(world.api(`/routines/${routine.id}/logbook`), world.people.author)).body,
    );
    expect(own).toMatchObject({ promotions: [], tenures: [], driftChecks: [] });
    expect(
      (await call(world.api(`/routines/${routine.id}/logbook`), world.people.outsider)).status,
    ).toBe(404);
  });
});
