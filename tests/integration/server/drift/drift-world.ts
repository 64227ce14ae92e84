import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { promotions, type MetricsSnapshot } from '@server/db/schema/promotions.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import type { JobWorld } from '../jobs/job-world.ts';

/**
 * Makes `source` the routine's incumbent: a promoted candidate with one revision, the
 * completed trial it was promoted on and, unless `snapshot` is null, the promotion with that
 * metrics snapshot.
 */
export async function seedIncumbent(
  db: Db,
  world: JobWorld,
  source: string,
  snapshot: MetricsSnapshot | null,
): Promise<{ revisionId: number; promotionId: number | null }> {
  const [candidate] = await db
    .insert(candidates)
    .values({
      routineId: world.routineId,
      authorId: world.author.id,
      title: 'Incumbent LU',
      state: 'promoted',
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
  const [trial] = await db
    .insert(trials)
    .values({
      routineId: world.routineId,
      revisionId: revision!.id,
      matrixSetId: world.matrixSetId,
      status: 'completed',
      passed: true,
      progress: { phase: 'done', done: 3, total: 3 },
      finishedAt: new Date(),
    })
    .returning();
  await db
    .update(routines)
    .set({ incumbentRevisionId: revision!.id })
    .where(eq(routines.id, world.routineId));
  if (!snapshot) return { revisionId: revision!.id, promotionId: null };
  const [promotion] = await db
    .insert(promotions)
    .values({
      routineId: world.routineId,
      revisionId: revision!.id,
      trialId: trial!.id,
      kind: 'promote',
      promotedBy: world.maintainer.id,
      note: 'Faster on the bay-frame matrices.',
      metricsSnapshot: snapshot,
    })
    .returning();
  return { revisionId: revision!.id, promotionId: promotion!.id };
}
