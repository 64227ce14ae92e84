import { desc, eq } from 'drizzle-orm';
import { createCommentSchema } from '@shared/api/comments.ts';
import { promoteSchema, reinstateSchema } from '@shared/api/promotions.ts';
import { createReviewSchema } from '@shared/api/reviews.ts';
import { withdrawCandidate } from '@server/candidates/candidates.service.ts';
import { addComment } from '@server/comments/comments.service.ts';
import type { Db } from '@server/db/client.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { runDriftChecks } from '@server/drift/drift-checks.service.ts';
import { promoteCandidate } from '@server/promotions/promotions.service.ts';
import { reinstateIncumbent } from '@server/promotions/reinstate.service.ts';
import { submitReview } from '@server/reviews/reviews.service.ts';
import { person } from './demo-people.ts';
import type { DemoEvent } from './demo-story.ts';
import { playDraft, playRevise, playSubmit } from './demo-submissions.ts';
import { idOf, type DemoWorld } from './demo-world.ts';

async function latestRevision(db: Db, candidateId: number) {
  const [row] = await db
    .select({ id: revisions.id, source: revisions.source })
    .from(revisions)
    .where(eq(revisions.candidateId, candidateId))
    .orderBy(desc(revisions.number))
    .limit(1);
  if (!row) throw new Error(`candidate ${candidateId} has no revision to comment on`);
  return row;
}

/** The 1-based number of the first line of `source` containing `text`. */
export function lineContaining(source: string, text: string): number {
  const index = source.split('\n').findIndex((line) => line.includes(text));
  if (index < 0) throw new Error(`no line of the revision contains "${text}"`);
  return index + 1;
}

/**
 * Carries out one event of the story through the same services the API calls, with inputs
 * parsed by the API's own schemas.
 */
export async function playEvent(world: DemoWorld, event: DemoEvent): Promise<void> {
  const { db, env, people } = world;
  switch (event.kind) {
    case 'submit':
      return playSubmit(world, event);
    case 'revise':
      return playRevise(world, event);
    case 'draft':
      return playDraft(world, event);
    case 'comment': {
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      let place = {};
      if (event.line !== undefined) {
        const revision = await latestRevision(db, candidateId);
        place = { revisionId: revision.id, line: lineContaining(revision.source, event.line) };
      }
      const input = createCommentSchema.parse({ body: event.body, ...place });
      await addComment(db, person(people, event.by), candidateId, input);
      return;
    }
    case 'review': {
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      const input = createReviewSchema.parse({ verdict: event.verdict, body: event.body });
      await submitReview(db, env, person(people, event.by), candidateId, input);
      return;
    }
    case 'promote': {
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      const input = promoteSchema.parse({ note: event.note });
      const outcome = await promoteCandidate(db, env, person(people, event.by), candidateId, input);
      world.promotions.set(event.candidate, outcome.promotion.id);
      return;
    }
    case 'reinstate': {
      const routineId = idOf(world.routines, event.routine, 'routine');
      const promotionId = idOf(world.promotions, event.candidate, 'promotion of');
      const input = reinstateSchema.parse({ promotionId, note: event.note });
      await reinstateIncumbent(db, env, person(people, event.by), routineId, input);
      return;
    }
    case 'withdraw': {
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      await withdrawCandidate(db, person(people, event.by), candidateId);
      return;
    }
    case 'drift-check': {
      const routineId = idOf(world.routines, event.routine, 'routine');
      const started = await runDriftChecks(db, world.queue, { routineIds: [routineId] });
      if (started.length !== 1) throw new Error(`no drift check started for ${event.routine}`);
      for (const trialId of world.queue.take()) {
        await world.trials.run(trialId, { optimiserOff: event.runtime === 'optimiser-off' });
      }
      return;
    }
  }
}
