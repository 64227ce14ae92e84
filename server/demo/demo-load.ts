import { performance } from 'node:perf_hooks';
import { count, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { teams } from '@server/db/schema/teams.ts';
import { createDemoClock, momentTime } from './demo-clock.ts';
import { playEvent } from './demo-events.ts';
import { createDemoPeople } from './demo-people.ts';
import { createDemoRoutines, uploadStiffnessMatrices } from './demo-routine-setup.ts';
import { demoStory, setupMoments, type DemoMoment } from './demo-story.ts';
import { demoTeam } from './demo-team.ts';
import { createDemoQueue, createDemoTrialRunner } from './demo-trials.ts';
import type { DemoWorld } from './demo-world.ts';

export type DemoLoadResult =
  | { loaded: false; reason: string }
  | {
      loaded: true;
      teamId: number;
      teamSlug: string;
      trialsRun: number;
      /** Trials the story leaves queued: the caller hands them to the job queue after commit. */
      queuedTrialIds: number[];
      seconds: number;
    };

export interface DemoLoadOptions {
  logger: Pick<Logger, 'info' | 'warn' | 'error'>;
  /** The time the story counts back from; now by default. */
  anchor?: Date;
}

/** Same key for every loader, so two loads at once take turns and the second one skips. */
const DEMO_LOCK_KEY = 4_210_001;

/**
 * Loads the demo team's story into an instance that has no teams yet, in one transaction: the
 * five people, the team, the uploaded stiffness matrices, three routines with their matrix sets,
 * and every event of demo-story.ts through the services the API uses, with every trial run by
 * the worker's own job function here and now. Rows get the times of the story (demo-clock.ts).
 * A failure anywhere rolls the whole load back. An instance with a team is left alone.
 */
export async function loadDemo(
  db: Db,
  env: Env,
  options: DemoLoadOptions,
): Promise<DemoLoadResult> {
  const started = performance.now();
  const anchor = options.anchor ?? new Date();
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${DEMO_LOCK_KEY})`);
    const [existing] = await tx.select({ n: count() }).from(teams);
    if ((existing?.n ?? 0) > 0) {
      return { loaded: false, reason: `the database has ${existing!.n} team(s) already` };
    }
    // The services take the database handle; inside this transaction they get the transaction,
    // and their own transactions become savepoints of it, so the load commits whole or not at all.
    const txDb = tx as unknown as Db;
    const clock = await createDemoClock(tx);
    const stampAt = (moment: DemoMoment, step: number) =>
      clock.stamp(new Date(momentTime(anchor, moment).getTime() + step * 60_000));

    const people = await createDemoPeople(txDb);
    await stampAt(setupMoments.team, 0);
    const uploadIds = await uploadStiffnessMatrices(txDb, people);
    await stampAt(setupMoments.uploads, 0);
    const routines = await createDemoRoutines(txDb, people, uploadIds);
    await stampAt(setupMoments.routines, 0);

    const world: DemoWorld = {
      db: txDb,
      env,
      people,
      routines,
      queue: createDemoQueue(),
      trials: createDemoTrialRunner(txDb, env, options.logger),
      candidates: new Map(),
      promotions: new Map(),
      leftQueued: [],
    };
    let previous: DemoMoment | null = null;
    let step = 0;
    for (const event of demoStory) {
      await playEvent(world, event);
      step = previous && previous.day === event.day && previous.hour === event.hour ? step + 1 : 0;
      previous = event;
      await stampAt(event, step);
    }
    options.logger.info({ trials: world.trials.count() }, 'demo story played');
    return {
      loaded: true,
      teamId: people.teamId,
      teamSlug: demoTeam.slug,
      trialsRun: world.trials.count(),
      queuedTrialIds: world.leftQueued,
      seconds: (performance.now() - started) / 1000,
    };
  });
}
