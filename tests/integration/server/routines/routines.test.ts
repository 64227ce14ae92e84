import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { defaultAcceptancePolicy } from '@shared/acceptance-policy.ts';
import { matrixSetDetailSchema } from '@shared/api/matrix-sets.ts';
import { routineDetailSchema, routinePageSchema } from '@shared/api/routines.ts';
import { contractTexts } from '@shared/contracts/contract-texts.ts';
import type { CandidateState } from '@shared/states.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import {
  createTeamWorld,
  startTeamFixture,
  type TeamFixture,
  type TeamWorld,
} from '@tests/helpers/team-fixture.ts';

let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(() => f.close());

async function makeSet(world: TeamWorld, name = `set ${Math.random().toString(36).slice(2, 8)}`) {
  const res = await f.call(`/teams/${world.team.id}/matrix-sets`, world.people.maintainer, 'POST', {
    name,
    timingSizes: [64, 128],
    items: [
      { kind: 'generated', family: 'spd-random', n: 16 },
      { kind: 'generated', family: 'hilbert', n: 6 },
    ],
  });
  expect(res.status).toBe(201);
  return matrixSetDetailSchema.parse(res.body);
}

async function makeRoutine(
  world: TeamWorld,
  matrixSetId: number,
  extra: Record<string, unknown> = {},
) {
  const res = await f.call(`/teams/${world.team.id}/routines`, world.people.maintainer, 'POST', {
    slug: 'frame-cholesky',
    title: 'Frame stiffness Cholesky',
    contract: 'cholesky',
    matrixSetId,
    ...extra,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return routineDetailSchema.parse(res.body);
}

/** A candidate in `state` with one revision; returns the revision id. */
async function seedCandidate(routineId: number, authorId: number, state: CandidateState) {
  const [candidate] = await f.db
    .insert(candidates)
    .values({ routineId, authorId, title: `Blocked Cholesky (${state})`, state })
    .returning();
  const source = `export {} // ${state} ${candidate!.id}`;
  const [revision] = await f.db
    .insert(revisions)
    .values({
      candidateId: candidate!.id,
      number: 1,
      source,
      sourceHash: createHash('sha256').update(source).digest('hex'),
      diagnostics: [],
      createdBy: authorId,
    })
    .returning();
  return revision!.id;
}

describe('routines', () => {
  it('creates a routine with the policy defaults filled in, and records it', async () => {
    const world = await createTeamWorld(f.db);
    const set = await makeSet(world);
    const routine = await makeRoutine(world, set.id, { policy: { signOffsRequired: 2 } });
    expect(routine).toMatchObject({
      teamId: world.team.id,
      slug: 'frame-cholesky',
      contract: 'cholesky',
      myRole: 'maintainer',
      policy: { ...defaultAcceptancePolicy, signOffsRequired: 2 },
      matrixSet: { id: set.id, name: set.name, itemCount: 2, timingSizes: [64, 128] },
      incumbent: null,
      headline: null,
    });
    expect(routine.contractText).toBe(contractTexts.cholesky);
    expect(routine.starterSource).toBe(readKernelSource('starters/cholesky.ts'));
    const [audit] = await f.db
      .select()
      .from(auditLog)
      .where(eq(auditLog.teamId, world.team.id))
      .then((rows) => rows.filter((r) => r.action === 'routine.created'));
    expect(audit).toMatchObject({ entityId: routine.id, actorId: world.people.maintainer.id });
  });

  it('shows a routine to every member and to nobody outside the team', async () => {
    const world = await createTeamWorld(f.db);
    const routine = await makeRoutine(world, (await makeSet(world)).id);
    const asAuthor = routineDetailSchema.parse(
      (await f.call(`/routines/${routine.id}`, world.people.author)).body,
    );
    expect(asAuthor.myRole).toBe('author');
    expect(asAuthor.starterSource).toContain('export function factor');
    for (const stranger of [world.people.outsider, world.people.admin]) {
      const res = await f.call(`/routines/${routine.id}`, stranger);
      expect(res.status).toBe(404);
      expect(res.body).toEqual((await f.call('/routines/99999999', stranger)).body);
    }
  });

  it('lists routines with the incumbent’s headline figures and open candidates per state', async () => {
    const world = await createTeamWorld(f.db);
    const set = await makeSet(world);
    const routine = await makeRoutine(world, set.id);
    const author = world.people.author.id;
    const incumbent = await seedCandidate(routine.id, author, 'promoted');
    for (const state of ['in-review', 'in-review', 'cleared', 'withdrawn', 'returned'] as const) {
      await seedCandidate(routine.id, author, state);
    }
    const [trial] = await f.db
      .insert(trials)
      .values({
        routineId: routine.id,
        revisionId: incumbent,
        matrixSetId: set.id,
        status: 'completed',
        passed: true,
        progress: { phase: 'done', done: 2, total: 2 },
      })
      .returning();
    await f.db.insert(promotions).values({
      routineId: routine.id,
      revisionId: incumbent,
      trialId: trial!.id,
      kind: 'promote',
      promotedBy: world.people.maintainer.id,
      note: 'Blocked version, faster at 128',
      metricsSnapshot: {
        worstFactorRatio: 2.5,
        worstForwardErrorOverBound: 0.1,
        timing: [
          { n: 128, medianMs: 3.25, gflops: 0.2 },
          { n: 64, medianMs: 0.5, gflops: 0.2 },
        ],
      },
    });
    await f.db
      .update(routines)
      .set({ incumbentRevisionId: incumbent })
      .where(eq(routines.id, routine.id));

    const page = routinePageSchema.parse(
      (await f.call(`/teams/${world.team.id}/routines`, world.people.reviewer)).body,
    );
    expect(page.total).toBe(1);
    expect(page.items[0]).toMatchObject({
      id: routine.id,
      incumbentRevisionId: incumbent,
      incumbent: { candidateTitle: 'Blocked Cholesky (promoted)', revisionNumber: 1 },
      headline: { worstFactorRatio: 2.5, timingN: 128, timingMedianMs: 3.25 },
      openCandidates: {
        drafting: 0,
        'on-trial': 0,
        'in-review': 2,
        cleared: 1,
        returned: 1,
        'trial-failed': 0,
      },
    });
    const detail = routineDetailSchema.parse(
      (await f.call(`/routines/${routine.id}`, world.people.author)).body,
    );
    expect(detail.incumbent).toMatchObject({
      revisionId: incumbent,
      revisionNumber: 1,
      candidateTitle: 'Blocked Cholesky (promoted)',
      promotion: {
        trialId: trial!.id,
        promotedBy: { id: world.people.maintainer.id },
        headline: { timingN: 128 },
      },
    });
  });

  it('changes only the thresholds named in a policy patch, and records old and new values', async () => {
    const world = await createTeamWorld(f.db);
    const routine = await makeRoutine(world, (await makeSet(world)).id);
    const other = await makeSet(world);
    const res = await f.call(`/routines/${routine.id}`, world.people.maintainer, 'PATCH', {
      title: 'Frame Cholesky (blocked)',
      policy: { allowedSlowdown: 0.1 },
      matrixSetId: other.id,
    });
    expect(res.status).toBe(200);
    expect(routineDetailSchema.parse(res.body)).toMatchObject({
      title: 'Frame Cholesky (blocked)',
      policy: { ...defaultAcceptancePolicy, allowedSlowdown: 0.1 },
      matrixSetId: other.id,
    });
    const audit = (
      await f.db.select().from(auditLog).where(eq(auditLog.teamId, world.team.id))
    ).find((a) => a.action === 'routine.updated');
    expect(audit!.details).toMatchObject({
      changes: {
        title: { from: 'Frame stiffness Cholesky', to: 'Frame Cholesky (blocked)' },
        policy: { from: { allowedSlowdown: 0.05 }, to: { allowedSlowdown: 0.1 } },
        matrixSetId: { from: routine.matrixSetId, to: other.id },
      },
    });
    expect(audit!.details.changes).not.toHaveProperty('description');
  });

  it('refuses bad bodies: unknown fields, wrong types, another team’s set, a taken slug', async () => {
    const world = await createTeamWorld(f.db);
    const set = await makeSet(world);
    const foreign = await makeSet(await createTeamWorld(f.db));
    const url = `/teams/${world.team.id}/routines`;
    const base = {
      slug: 'frame-qr',
      title: 'Frame QR',
      contract: 'householder-qr',
      matrixSetId: set.id,
    };
    const bad: [Record<string, unknown>, string][] = [
      [{ ...base, contract: 'svd' }, 'contract'],
      [{ ...base, matrixSetId: String(set.id) }, 'matrixSetId'],
      [{ ...base, policy: { signOffsRequired: 0 } }, 'policy.signOffsRequired'],
      [{ ...base, policy: { strictness: 3 } }, 'policy'],
      [{ ...base, owner: 'me' }, ''],
      [{ ...base, slug: 'Frame QR' }, 'slug'],
      [{ ...base, matrixSetId: foreign.id }, 'matrixSetId'],
    ];
    for (const [body, path] of bad) {
      const res = await f.call(url, world.people.maintainer, 'POST', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body).toMatchObject({
        error: {
          code: 'validation-failed',
          details: expect.arrayContaining([expect.objectContaining({ path })]),
        },
      });
    }
    expect((await f.call(url, world.people.maintainer, 'POST', base)).status).toBe(201);
    expect((await f.call(url, world.people.maintainer, 'POST', base)).status).toBe(409);

    const routine = (await f.call(url, world.people.author)).body as { items: { id: number }[] };
    const patchUrl = `/routines/${routine.items[0]!.id}`;
    for (const body of [
      {},
      { policy: { maxFactorRatio: -1 } },
      { slug: 'renamed' },
      { matrixSetId: foreign.id },
    ]) {
      const res = await f.call(patchUrl, world.people.maintainer, 'PATCH', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect((await f.call('/routines/abc', world.people.author)).status).toBe(400);
  });
});
