import { inArray } from 'drizzle-orm';
import { pino } from 'pino';
import type { Database } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { trials } from '@server/db/schema/trials.ts';
import { createPgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { sourceHash } from '@server/revisions/revision-submission.ts';
import { insertQueuedTrial } from '@server/trials/trials.repo.ts';
import { startWorker, type StartedProcess } from './child-processes.ts';
import { candidateSource } from './seed-templates.ts';

export interface QueueRoutine {
  routineId: number;
  matrixSetId: number;
  incumbentRevisionId: number;
  authorId: number;
}

export interface QueueRun {
  workers: number;
  trials: number;
  /** From the first job sent to the last trial finished. */
  seconds: number;
  perMinute: number;
  /**
   * Trials per minute after each worker's first trial (from the `workers`-th finish to the
   * last): without the first trial's type-checker start-up.
   */
  steadyPerMinute: number | null;
  statuses: Record<string, number>;
  /** How long starting the workers took, until each was consuming. */
  startSeconds: number;
}

/** Candidates on trial, one revision each, and their queued trials, as a submission leaves them. */
async function queuedTrials(database: Database, routine: QueueRoutine, count: number) {
  const db = database.db;
  const ids: number[] = [];
  for (let i = 0; i < count; i++) {
    const [candidate] = await db
      .insert(candidates)
      .values({
        routineId: routine.routineId,
        authorId: routine.authorId,
        title: `Queue run candidate ${i + 1}`,
        state: 'on-trial',
      })
      .returning();
    const source = `${candidateSource}\n// queue run ${i + 1}\n`;
    const [revision] = await db
      .insert(revisions)
      .values({
        candidateId: candidate!.id,
        number: 1,
        source,
        sourceHash: sourceHash(source),
        diagnostics: [],
        createdBy: routine.authorId,
      })
      .returning();
    const trial = await insertQueuedTrial(db, {
      routineId: routine.routineId,
      revisionId: revision!.id,
      incumbentRevisionId: routine.incumbentRevisionId,
      matrixSetId: routine.matrixSetId,
    });
    ids.push(trial.id);
  }
  return ids;
}

/**
 * Starts `workers` worker processes and waits until each is consuming, then queues `count`
 * trials on the routine (rows as a submission writes them, jobs through the app's own pg-boss
 * queue) and polls until all have finished. The workers are stopped before returning.
 */
export async function measureQueue(
  database: Database,
  databaseUrl: string,
  routine: QueueRoutine,
  workers: number,
  count: number,
  timeoutMs: number,
  extraEnv: Record<string, string> = {},
): Promise<QueueRun> {
  const running: StartedProcess[] = [];
  const queue = await createPgBossQueue({ databaseUrl, logger: pino({ level: 'silent' }) });
  try {
    const starting = performance.now();
    for (let i = 0; i < workers; i++) running.push(await startWorker(databaseUrl, i, extraEnv));
    const startSeconds = (performance.now() - starting) / 1000;
    const ids = await queuedTrials(database, routine, count);
    const sent = Date.now();
    for (const id of ids) await queue.enqueueTrial(id);
    const finishedStates = ['completed', 'trial-failed', 'errored'];
    let rows: { status: string; finishedAt: Date | null }[] = [];
    while (Date.now() - sent < timeoutMs) {
      rows = await database.db
        .select({ status: trials.status, finishedAt: trials.finishedAt })
        .from(trials)
        .where(inArray(trials.id, ids));
      if (rows.every((r) => finishedStates.includes(r.status))) break;
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
    const statuses: Record<string, number> = {};
    for (const r of rows) statuses[r.status] = (statuses[r.status] ?? 0) + 1;
    const finishes = rows
      .filter((r) => finishedStates.includes(r.status) && r.finishedAt)
      .map((r) => r.finishedAt!.getTime())
      .sort((a, b) => a - b);
    const last = finishes[finishes.length - 1] ?? Date.now();
    const seconds = (last - sent) / 1000;
    const fromWarm = finishes[workers - 1];
    const steady =
      fromWarm !== undefined && finishes.length > workers && last > fromWarm
        ? ((finishes.length - workers) / (last - fromWarm)) * 60_000
        : null;
    return {
      workers,
      trials: count,
      seconds,
      perMinute: (finishes.length / seconds) * 60,
      steadyPerMinute: steady,
      statuses,
      startSeconds,
    };
  } finally {
    for (const worker of running) await worker.stop();
    await queue.stop();
  }
}
