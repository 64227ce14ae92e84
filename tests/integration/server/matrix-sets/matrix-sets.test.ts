import { createHash } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { matrixSetDetailSchema, matrixSetPageSchema } from '@shared/api/matrix-sets.ts';
import { routineDetailSchema } from '@shared/api/routines.ts';
import { uploadSchema } from '@shared/api/uploads.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { matrixSetItems, matrixSets } from '@server/db/schema/matrix-sets.ts';
import { revisions } from '@server/db/schema/revisions.ts';
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

const spring = [
  '%%MatrixMarket matrix array real general',
  '% Invented 2x3 spring-constant table, column by column.',
  '2 3',
  '1.5',
  '-2',
  '0.25',
  '4',
  '8',
  '-1',
  '',
].join('\n');

async function uploadSpring(world: Pick<TeamWorld, 'team' | 'people'>) {
  const res = await f.postFile(
    `/teams/${world.team.id}/uploads`,
    world.people.maintainer,
    spring,
    'springs.mtx',
  );
  expect(res.status).toBe(201);
  return uploadSchema.parse(res.body);
}

const setBody = (
  uploadId: number,
  name = `frame set ${Math.random().toString(36).slice(2, 8)}`,
) => ({
  name,
  description: 'Stiffness-like matrices of the frame model',
  timingSizes: [64, 128],
  items: [
    { kind: 'generated', family: 'hilbert', n: 8 },
    { kind: 'generated', family: 'uniform', n: 64, seed: 3 },
    { kind: 'generated', family: 'tall-random', n: 8, m: 16 },
    { kind: 'generated', family: 'worst-growth', n: 200, params: { alpha: 0.5 } },
    { kind: 'upload', uploadId },
  ],
});

describe('matrix sets', () => {
  it('builds a set from recipes and an upload, describing each matrix in one line', async () => {
    const world = await createTeamWorld(f.db);
    const file = await uploadSpring(world);
    const res = await f.call(
      `/teams/${world.team.id}/matrix-sets`,
      world.people.maintainer,
      'POST',
      setBody(file.id),
    );
    expect(res.status).toBe(201);
    const set = matrixSetDetailSchema.parse(res.body);
    expect(set).toMatchObject({
      teamId: world.team.id,
      itemCount: 5,
      routineCount: 0,
      timingSizes: [64, 128],
    });
    expect(set.items.map((i) => i.description)).toEqual([
      'hilbert, 8×8, 64 entries, symmetric',
      'uniform, 64×64, seed 3, 4096 entries, general',
      'tall-random, 16×8, seed 1, 128 entries, general',
      'worst-growth (alpha=0.5), 200×200, 40000 entries, general',
      'springs.mtx, 2×3, 6 entries, general',
    ]);
    // Defaults are stored with the recipe, so it means the same matrix on every run.
    expect(set.items[2]).toMatchObject({ family: 'tall-random', n: 8, m: 16, seed: 1, params: {} });
    expect(set.items[0]).toMatchObject({ m: null, seed: null });
    expect(set.items[4]).toMatchObject({
      kind: 'upload',
      uploadId: file.id,
      fileName: 'springs.mtx',
      rows: 2,
      cols: 3,
    });

    const page = matrixSetPageSchema.parse(
      (await f.call(`/teams/${world.team.id}/matrix-sets`, world.people.author)).body,
    );
    expect(page.items.map((s) => [s.id, s.itemCount])).toEqual([[set.id, 5]]);
    const [audit] = await f.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, set.id), eq(auditLog.entity, 'matrix-set')));
    expect(audit).toMatchObject({
      action: 'matrix-set.created',
      entity: 'matrix-set',
      actorId: world.people.maintainer.id,
    });
  });

  it('refuses recipes the engine rejects, naming the item', async () => {
    const world = await createTeamWorld(f.db);
    const url = `/teams/${world.team.id}/matrix-sets`;
    const items = [
      [{ kind: 'generated', family: 'not-a-family', n: 8 }, 'items.0', /family must be one of/],
      [{ kind: 'generated', family: 'hilbert', n: 8, m: 9 }, 'items.0', /m must equal n/],
      [
        { kind: 'generated', family: 'worst-growth', n: 8, params: { beta: 1 } },
        'items.0',
        /not a parameter/,
      ],
      [{ kind: 'generated', family: 'poisson-2d', n: 10 }, 'items.0', /perfect square/],
    ] as const;
    for (const [item, path, message] of items) {
      const res = await f.call(url, world.people.maintainer, 'POST', {
        name: 'x',
        timingSizes: [8],
        items: [item],
      });
      expect(res.status, JSON.stringify(item)).toBe(400);
      expect(res.body).toMatchObject({
        error: {
          code: 'validation-failed',
          details: [{ path, message: expect.stringMatching(message) }],
        },
      });
    }
    expect(
      await f.db.select().from(matrixSets).where(eq(matrixSets.teamId, world.team.id)),
    ).toHaveLength(0);
  });

  it('refuses another team’s upload, wrong types and unknown fields with 400', async () => {
    const mine = await createTeamWorld(f.db);
    const theirs = await createTeamWorld(f.db);
    const foreign = await uploadSpring(theirs);
    const url = `/teams/${mine.team.id}/matrix-sets`;
    const good = { kind: 'generated', family: 'hilbert', n: 4 };
    const res = await f.call(url, mine.people.maintainer, 'POST', {
      name: 'borrowed',
      timingSizes: [8],
      items: [good, { kind: 'upload', uploadId: foreign.id }],
    });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ error: { details: [{ path: 'items.1.uploadId' }] } });

    const bodies = [
      { name: 'a', timingSizes: [8], items: [{ ...good, n: '4' }] },
      { name: 'a', timingSizes: [8], items: [{ ...good, colour: 'red' }] },
      { name: 'a', timingSizes: [8, 8], items: [good] },
      { name: 'a', timingSizes: [8], items: [] },
      { name: 'a', timingSizes: [8], items: [good], owner: 'me' },
      { name: 'a', timingSizes: [8], items: [{ kind: 'upload', uploadId: '3' }] },
    ];
    for (const body of bodies) {
      const answer = await f.call(url, mine.people.maintainer, 'POST', body);
      expect(answer.status, JSON.stringify(body)).toBe(400);
      expect(answer.body).toMatchObject({
        error: { code: 'validation-failed', details: expect.any(Array) },
      });
    }
  });

  it('refuses a second set with the same name with 409', async () => {
    const world = await createTeamWorld(f.db);
    const file = await uploadSpring(world);
    const url = `/teams/${world.team.id}/matrix-sets`;
    expect(
      (await f.call(url, world.people.maintainer, 'POST', setBody(file.id, 'quick'))).status,
    ).toBe(201);
    const again = await f.call(url, world.people.maintainer, 'POST', setBody(file.id, 'quick'));
    expect(again.status).toBe(409);
  });

  it('replaces the items of a set with PUT', async () => {
    const world = await createTeamWorld(f.db);
    const file = await uploadSpring(world);
    const created = matrixSetDetailSchema.parse(
      (
        await f.call(
          `/teams/${world.team.id}/matrix-sets`,
          world.people.maintainer,
          'POST',
          setBody(file.id),
        )
      ).body,
    );
    const res = await f.call(`/matrix-sets/${created.id}`, world.people.maintainer, 'PUT', {
      name: 'frame set, smaller',
      timingSizes: [32],
      items: [{ kind: 'generated', family: 'lehmer', n: 6 }],
    });
    expect(res.status).toBe(200);
    const replaced = matrixSetDetailSchema.parse(res.body);
    expect(replaced).toMatchObject({
      name: 'frame set, smaller',
      description: '',
      timingSizes: [32],
      itemCount: 1,
    });
    expect(replaced.items.map((i) => i.description)).toEqual([
      'lehmer, 6×6, 36 entries, symmetric',
    ]);
    const rows = await f.db
      .select()
      .from(matrixSetItems)
      .where(eq(matrixSetItems.matrixSetId, created.id));
    expect(rows).toHaveLength(1);
    const audit = await f.db.select().from(auditLog).where(eq(auditLog.teamId, world.team.id));
    expect(audit.find((a) => a.action === 'matrix-set.replaced')).toMatchObject({
      entityId: created.id,
      details: { name: 'frame set, smaller', items: { from: 5, to: 1 } },
    });
  });

  it('deletes an unused set, and refuses one a routine uses or a trial ran on', async () => {
    const world = await createTeamWorld(f.db);
    const file = await uploadSpring(world);
    const make = async () =>
      matrixSetDetailSchema.parse(
        (
          await f.call(
            `/teams/${world.team.id}/matrix-sets`,
            world.people.maintainer,
            'POST',
            setBody(file.id),
          )
        ).body,
      );
    const used = await make();
    const routine = routineDetailSchema.parse(
      (
        await f.call(`/teams/${world.team.id}/routines`, world.people.maintainer, 'POST', {
          slug: 'frame-lu',
          title: 'Frame solver LU',
          contract: 'lu-partial-pivoting',
          matrixSetId: used.id,
        })
      ).body,
    );
    const refused = await f.call(`/matrix-sets/${used.id}`, world.people.maintainer, 'DELETE');
    expect(refused.status).toBe(409);
    expect(refused.body).toMatchObject({
      error: { message: expect.stringContaining('Frame solver LU') },
    });

    const history = await make();
    const [candidate] = await f.db
      .insert(candidates)
      .values({ routineId: routine.id, authorId: world.people.author.id, title: 'Blocked LU' })
      .returning();
    const [revision] = await f.db
      .insert(revisions)
      .values({
        candidateId: candidate!.id,
        number: 1,
        source: 'export {}',
        sourceHash: createHash('sha256').update('export {}').digest('hex'),
        diagnostics: [],
        createdBy: world.people.author.id,
      })
      .returning();
    await f.db.insert(trials).values({
      routineId: routine.id,
      revisionId: revision!.id,
      matrixSetId: history.id,
      progress: { phase: 'queued', done: 0, total: 0 },
    });
    const kept = await f.call(`/matrix-sets/${history.id}`, world.people.maintainer, 'DELETE');
    expect(kept.status).toBe(409);
    expect(kept.body).toMatchObject({
      error: { message: expect.stringMatching(/Trials have run/) },
    });

    const unused = await make();
    expect(
      (await f.call(`/matrix-sets/${unused.id}`, world.people.maintainer, 'DELETE')).status,
    ).toBe(204);
    expect((await f.call(`/matrix-sets/${unused.id}`, world.people.maintainer)).status).toBe(404);
    const left = await f.db.select().from(matrixSets).where(eq(matrixSets.teamId, world.team.id));
    expect(left.map((s) => s.id).sort()).toEqual([used.id, history.id].sort());
    const audit = await f.db.select().from(auditLog).where(eq(auditLog.teamId, world.team.id));
    expect(audit.filter((a) => a.action === 'matrix-set.deleted').map((a) => a.entityId)).toEqual([
      unused.id,
    ]);
  });
});
