import { createCandidateSchema } from '@shared/api/candidates.ts';
import { createRevisionSchema } from '@shared/api/revisions.ts';
import { recordAudit } from '@server/audit/audit.ts';
import { insertCandidate } from '@server/candidates/candidates.repo.ts';
import { createCandidate } from '@server/candidates/candidates.service.ts';
import type { TrialRow } from '@server/jobs/finished-trial.ts';
import { submitRevision } from '@server/revisions/revisions.service.ts';
import { demoKernelSource } from './demo-kernels.ts';
import { person } from './demo-people.ts';
import type { DemoEvent } from './demo-story.ts';
import { idOf, type DemoWorld } from './demo-world.ts';

type EventOf<K extends DemoEvent['kind']> = Extract<DemoEvent, { kind: K }>;

/** How many times a candidate the story promotes is submitted again after a timing-only miss. */
const TIMING_RETRIES = 2;

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
  mode: EventOf<'submit'>['trial'],
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

/** A new candidate through the candidates service, then its trial. */
export async function playSubmit(world: DemoWorld, event: EventOf<'submit'>): Promise<void> {
  const by = person(world.people, event.by);
  const routineId = idOf(world.routines, event.routine, 'routine');
  const input = createCandidateSchema.parse({
    title: event.title,
    description: event.description,
    source: demoKernelSource(event.kernel),
  });
  const submitted = await createCandidate(world.db, world.queue, by, routineId, input);
  world.candidates.set(event.candidate, submitted.candidate.id);
  const again = createRevisionSchema.parse({ source: input.source });
  await runQueued(world, event.trial, async () => {
    await submitRevision(world.db, world.queue, by, submitted.candidate.id, again);
  });
}

/** A new revision through the revisions service, then its trial. */
export async function playRevise(world: DemoWorld, event: EventOf<'revise'>): Promise<void> {
  const by = person(world.people, event.by);
  const candidateId = idOf(world.candidates, event.candidate, 'candidate');
  const input = createRevisionSchema.parse({ source: demoKernelSource(event.kernel) });
  await submitRevision(world.db, world.queue, by, candidateId, input);
  await runQueued(world, event.trial, async () => {
    await submitRevision(world.db, world.queue, by, candidateId, input);
  });
}

/**
 * A candidate still being drafted: no revision yet. The API has no route for this (a candidate
 * is created with its first revision), so the row is written as the repository writes it, with
 * its audit entry.
 */
export async function playDraft(world: DemoWorld, event: EventOf<'draft'>): Promise<void> {
  const by = person(world.people, event.by);
  const row = await insertCandidate(world.db, {
    routineId: idOf(world.routines, event.routine, 'routine'),
    authorId: by.id,
    title: event.title,
    description: event.description,
  });
  world.candidates.set(event.candidate, row.id);
  await recordAudit(world.db, {
    actorId: by.id,
    teamId: world.people.teamId,
    action: 'candidate.drafted',
    entity: 'candidate',
    entityId: row.id,
    details: { to: 'drafting' },
  });
}
