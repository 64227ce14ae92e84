import { desc, eq } from 'drizzle-orm';
import { createCandidateSchema } from '@shared/api/candidates.ts';
import { createCommentSchema } from '@shared/api/comments.ts';
import { promoteSchema, reinstateSchema } from '@shared/api/promotions.ts';
import { createReviewSchema } from '@shared/api/reviews.ts';
import { createRevisionSchema } from '@shared/api/revisions.ts';
import { recordAudit } from '@server/audit/audit.ts';
import { insertCandidate } from '@server/candidates/candidates.repo.ts';
import { createCandidate, withdrawCandidate } from '@server/candidates/candidates.service.ts';
import { addComment } from '@server/comments/comments.service.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { runDriftChecks } from '@server/drift/drift-checks.service.ts';
import type { TrialRow } from '@server/jobs/finished-trial.ts';
import { promoteCandidate } from '@server/promotions/promotions.service.ts';
import { reinstateIncumbent } from '@server/promotions/reinstate.service.ts';
import { submitReview } from '@server/reviews/reviews.service.ts';
import { submitRevision } from '@server/revisions/revisions.service.ts';
import { demoKernelSource } from './demo-kernels.ts';
import { person, type DemoPeople } from './demo-people.ts';
import type { DemoRoutineKey } from './demo-routines.ts';
import type { DemoEvent } from './demo-story.ts';
import type { DemoQueue, DemoTrialRunner } from './demo-trials.ts';

/** Everything the story's events act on, and what they leave behind. */
export interface DemoWorld {
  db: Db;
  env: Env;
  people: DemoPeople;
  routines: Map<DemoRoutineKey, number>;
  queue: DemoQueue;
  trials: DemoTrialRunner;
  /** Candidate ids by the story's keys. */
  candidates: Map<string, number>;
  /** The promotion that made each candidate the incumbent, by the story's key. */
  promotions: Map<string, number>;
  /** Trials left queued for the worker. */
  leftQueued: number[];
}

/** How many times a candidate the story promotes is submitted again after a timing-only miss. */
const TIMING_RETRIES = 2;

function idOf(map: Map<string, number>, key: string, what: string): number {
  const id = map.get(key);
  if (id === undefined) throw new Error(`the demo story names ${what} ${key} before creating it`);
  return id;
}

/** A trial whose only failed rule is timing: noise at the demo's small sizes, not a flaw. */
function failedOnTimingOnly(trial: TrialRow): boolean {
  const failed = trial.verdict?.rules.filter((r) => !r.passed) ?? [];
  return (
    trial.status === 'completed' && failed.length > 0 && failed.every((r) => r.rule === 'timing')
  );
}

/**
 * Runs the trials a submission queued, or leaves them queued. For `run-until-passed`, a trial
 * that failed on timing alone is run again the way an author would: the same source submitted
 * as the next revision. Any other failure of a trial the story needs to pass stops the load.
 */
async function runQueued(
  world: DemoWorld,
  mode: 'run' | 'run-until-passed' | 'queue',
  resubmit: () => Promise<void>,
): Promise<void> {
  const queued = world.queue.take();
  if (mode === 'queue') {
    world.leftQueued.push(...queued);
    return;
  }
  for (const trialId of queued) {
    let trial = await world.trials.run(trialId);
    for (let retry = 0; mode === 'run-until-passed' && retry < TIMING_RETRIES; retry++) {
      if (!failedOnTimingOnly(trial)) break;
      await resubmit();
      const [again] = world.queue.take();
      if (again === undefined) throw new Error('the resubmission queued no trial');
      trial = await world.trials.run(again);
    }
    if (mode === 'run-until-passed' && trial.passed !== true) {
      const reasons = trial.verdict?.rules.filter((r) => !r.passed).map((r) => r.reason) ?? [];
      throw new Error(
        `demo trial ${trial.id} was meant to pass but did not (${trial.status}): ${reasons.join(' ') || (trial.message ?? '')}`,
      );
    }
  }
}

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

/** Carries out one event of the story through the same services the API calls. */
export async function playEvent(world: DemoWorld, event: DemoEvent): Promise<void> {
  const { db, env, people } = world;
  switch (event.kind) {
    case 'submit': {
      const by = person(people, event.by);
      const routineId = idOf(world.routines, event.routine, 'routine');
      const input = createCandidateSchema.parse({
        title: event.title,
        description: event.description,
        source: demoKernelSource(event.kernel),
      });
      const submitted = await createCandidate(db, world.queue, by, routineId, input);
      world.candidates.set(event.candidate, submitted.candidate.id);
      const again = createRevisionSchema.parse({ source: input.source });
      await runQueued(world, event.trial, async () => {
        await submitRevision(db, world.queue, by, submitted.candidate.id, again);
      });
      return;
    }
    case 'revise': {
      const by = person(people, event.by);
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      const input = createRevisionSchema.parse({ source: demoKernelSource(event.kernel) });
      await submitRevision(db, world.queue, by, candidateId, input);
      await runQueued(world, event.trial, async () => {
        await submitRevision(db, world.queue, by, candidateId, input);
      });
      return;
    }
    case 'draft': {
      const by = person(people, event.by);
      const routineId = idOf(world.routines, event.routine, 'routine');
      const row = await insertCandidate(db, {
        routineId,
        authorId: by.id,
        title: event.title,
        description: event.description,
      });
      world.candidates.set(event.candidate, row.id);
      await recordAudit(db, {
        actorId: by.id,
        teamId: people.teamId,
        action: 'candidate.drafted',
        entity: 'candidate',
        entityId: row.id,
        details: { to: 'drafting' },
      });
      return;
    }
    case 'comment': {
      const by = person(people, event.by);
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      let place = {};
      if (event.line !== undefined) {
        const revision = await latestRevision(db, candidateId);
        place = { revisionId: revision.id, line: lineContaining(revision.source, event.line) };
      }
      const input = createCommentSchema.parse({ body: event.body, ...place });
      await addComment(db, by, candidateId, input);
      return;
    }
    case 'review': {
      const by = person(people, event.by);
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      const input = createReviewSchema.parse({ verdict: event.verdict, body: event.body });
      await submitReview(db, env, by, candidateId, input);
      return;
    }
    case 'promote': {
      const by = person(people, event.by);
      const candidateId = idOf(world.candidates, event.candidate, 'candidate');
      const outcome = await promoteCandidate(
        db,
        env,
        by,
        candidateId,
        promoteSchema.parse({ note: event.note }),
      );
      world.promotions.set(event.candidate, outcome.promotion.id);
      return;
    }
    case 'reinstate': {
      const by = person(people, event.by);
      const routineId = idOf(world.routines, event.routine, 'routine');
      const promotionId = idOf(world.promotions, event.candidate, 'promotion of');
      const input = reinstateSchema.parse({ promotionId, note: event.note });
      await reinstateIncumbent(db, env, by, routineId, input);
      return;
    }
    case 'withdraw': {
      const by = person(people, event.by);
      await withdrawCandidate(db, by, idOf(world.candidates, event.candidate, 'candidate'));
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
