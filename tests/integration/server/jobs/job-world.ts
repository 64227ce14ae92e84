import { createHash, randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { defaultAcceptancePolicy } from '@shared/acceptance-policy.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { matrixSetItems, matrixSets } from '@server/db/schema/matrix-sets.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { teams } from '@server/db/schema/teams.ts';
import { trials } from '@server/db/schema/trials.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';

/** A matrix set item: a generated recipe, or a Matrix Market file stored as an upload. */
export type WorldItem = MatrixSpec | { fileName: string; content: string };

export interface JobWorld {
  teamId: number;
  routineId: number;
  matrixSetId: number;
  author: TestUser;
  reviewer: TestUser;
  maintainer: TestUser;
}

/** An example kernel's source (sandbox/kernels/examples). */
export function exampleSource(name: string): string {
  return readKernelSource(`examples/${name}.ts`);
}

/**
 * A team with an author, a reviewer and a maintainer, a matrix set of `items` with
 * `timingSizes`, and an LU-with-partial-pivoting routine on it with the default policy.
 */
export async function createJobWorld(
  db: Db,
  items: WorldItem[],
  timingSizes: number[],
): Promise<JobWorld> {
  const tag = randomUUID().slice(0, 8);
  const [team] = await db
    .insert(teams)
    .values({ slug: `kernels-${tag}`, name: `Kernel team ${tag}` })
    .returning();
  const [author, reviewer, maintainer] = [
    await createTestUser(db),
    await createTestUser(db),
    await createTestUser(db),
  ];
  await db.insert(memberships).values([
    { teamId: team!.id, userId: author.id, role: 'author' },
    { teamId: team!.id, userId: reviewer.id, role: 'reviewer' },
    { teamId: team!.id, userId: maintainer.id, role: 'maintainer' },
  ]);
  const [set] = await db
    .insert(matrixSets)
    .values({ teamId: team!.id, name: `set-${tag}`, timingSizes })
    .returning();
  for (const [position, item] of items.entries()) {
    if ('content' in item) {
      const [upload] = await db
        .insert(uploads)
        .values({
          teamId: team!.id,
          fileName: item.fileName,
          content: item.content,
          bytes: item.content.length,
          rows: 0,
          cols: 0,
          entries: 0,
          symmetry: 'general',
          field: 'real',
          format: 'coordinate',
          uploadedBy: author.id,
        })
        .returning();
      await db
        .insert(matrixSetItems)
        .values({ matrixSetId: set!.id, position, kind: 'upload', uploadId: upload!.id });
    } else {
      await db.insert(matrixSetItems).values({
        matrixSetId: set!.id,
        position,
        kind: 'generated',
        family: item.family,
        n: item.n,
        m: item.m ?? null,
        seed: item.seed ?? null,
        params: item.params ?? null,
      });
    }
  }
  const [routine] = await db
    .insert(routines)
    .values({
      teamId: team!.id,
      slug: `lu-${tag}`,
      title: `Dense LU ${tag}`,
      contract: 'lu-partial-pivoting',
      policy: defaultAcceptancePolicy,
      matrixSetId: set!.id,
    })
    .returning();
  return {
    teamId: team!.id,
    routineId: routine!.id,
    matrixSetId: set!.id,
    author,
    reviewer,
    maintainer,
  };
}

/** A candidate on trial with revision 1 of `source`, and its queued trial (as a submission makes). */
export async function queueCandidateTrial(
  db: Db,
  world: JobWorld,
  source: string,
): Promise<{ candidateId: number; revisionId: number; trialId: number }> {
  const [candidate] = await db
    .insert(candidates)
    .values({
      routineId: world.routineId,
      authorId: world.author.id,
      title: 'Right-looking LU',
      state: 'on-trial',
    })
    .returning();
  const [revision] = await db
    .insert(revisions)
    .values({
      candidateId: candidate!.id,
      number: 1,
      source,
      sourceHash: createHash('sha256').update(source).digest('hex'),
      diagnostics: [],
      createdBy: world.author.id,
    })
    .returning();
  const [routine] = await db.select().from(routines).where(eq(routines.id, world.routineId));
  const [trial] = await db
    .insert(trials)
    .values({
      routineId: world.routineId,
      revisionId: revision!.id,
      incumbentRevisionId: routine!.incumbentRevisionId,
      matrixSetId: world.matrixSetId,
      status: 'queued',
      progress: { phase: 'queued', done: 0, total: 0 },
    })
    .returning();
  return { candidateId: candidate!.id, revisionId: revision!.id, trialId: trial!.id };
}

/**
 * Polls `read` until it returns a value (not null, undefined or false), then returns it. The
 * limit only ends a test that would otherwise hang; nothing is asserted about the time taken.
 */
export async function waitFor<T>(
  read: () => Promise<T | null | undefined | false>,
  what: string,
  limitMs = 60_000,
  everyMs = 100,
): Promise<T> {
  const deadline = Date.now() + limitMs;
  for (;;) {
    const value = await read();
    if (value !== null && value !== undefined && value !== false) return value;
    if (Date.now() > deadline) throw new Error(`gave up waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, everyMs));
  }
}
