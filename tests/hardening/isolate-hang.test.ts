import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { createTrialProcess, type TrialProcess } from '@sandbox/trial-process/trial-process.ts';
import { closureChainHog } from '@tests/hardening/isolate-hang-probe.ts';
import {
  createJobWorld,
  exampleSource,
  queueCandidateTrial,
  type JobWorld,
} from '@tests/integration/server/jobs/job-world.ts';
import {
  candidateState,
  finishedTrial,
  matrixRows,
  trialRow,
} from '@tests/integration/server/jobs/trial-readers.ts';

// A heap hog that isolated-vm cannot stop (isolate-hang-probe.ts) in a real pg-boss worker in
// this process (a pg-boss schema of its own), whose trials run in a trial process as the worker
// process runs them (server/jobs/worker-process.ts), with a short deadline. The deadline only
// has to outlast a sound trial of two small matrices without timing; the memory cap is set high
// so that the deadline, not the cap, stops the hog here (the cap has its own test below).
const deadlineSeconds = 10;
const tinySet: MatrixSpec[] = [
  { family: 'uniform', n: 8, seed: 1 },
  { family: 'hilbert', n: 6 },
];

describe('a heap hog that isolated-vm cannot stop, in the worker', () => {
  let database: Database;
  let queue: PgBossQueue;
  let trials: TrialProcess;
  let world: JobWorld;
  const stuck: number[] = [];

  beforeAll(async () => {
    const databaseUrl = inject('databaseUrl');
    database = createDatabase(databaseUrl, 4);
    queue = await createPgBossQueue({
      databaseUrl,
      logger: pino({ level: 'silent' }),
      schema: 'pgboss_isolate_hang',
      trialJobs: { retryDelaySeconds: 1 },
    });
    trials = createTrialProcess({
      deadlineMs: deadlineSeconds * 1000,
      memoryMb: 8192,
      keepWarm: true,
    });
    trials.warm();
    await startTrialWorker({
      boss: queue.boss,
      queue,
      db: database.db,
      env: loadEnv({}),
      logger: pino({ level: 'silent' }),
      runTrial: (input) => trials.run(input),
      limits: { callTimeoutMs: 300, memoryLimitMb: 32 },
      onStuckTrial: (trialId) => stuck.push(trialId),
    });
    world = await createJobWorld(database.db, tinySet, []);
  });

  afterAll(async () => {
    await queue?.boss.stop({ graceful: false, wait: true });
    await trials?.close();
    await database?.pool.end();
  });

  it('ends the trial at its deadline as trial-failed, once, and the next trial completes', async () => {
    const sound = exampleSource('lu-partial-pivoting-right-looking');
    // A sound trial first, so that the hog's trial does not spend its deadline loading TypeScript.
    const before = await queueCandidateTrial(database.db, world, sound);
    const hog = await queueCandidateTrial(database.db, world, closureChainHog);
    const after = await queueCandidateTrial(database.db, world, sound);
    for (const { trialId } of [before, hog, after]) await queue.enqueueTrial(trialId);

    const stopped = await finishedTrial(database.db, hog.trialId, 180_000);
    expect(stopped.status).toBe('trial-failed');
    expect(stopped.message).toBe(
      `the trial was stopped after ${deadlineSeconds} s, its time limit: a kernel did not return and could not be interrupted (in the accuracy phase, uniform-n8-s1, 0 of 2 done)`,
    );
    expect(stopped.passed).toBe(false);
    expect(stopped.verdict?.rules[0]?.reason).toContain(stopped.message);
    // Stopped by the deadline: the trial ran that long and not less.
    expect(stopped.phases!.totalMs).toBeGreaterThanOrEqual(deadlineSeconds * 1000);
    expect(await matrixRows(database.db, hog.trialId)).toEqual([]);
    expect(await candidateState(database.db, hog.candidateId)).toBe('trial-failed');

    const next = await finishedTrial(database.db, after.trialId, 180_000);
    expect(next.status).toBe('completed');
    expect(next.passed).toBe(true);
    expect((await trialRow(database.db, before.trialId)).status).toBe('completed');

    // Recorded once, as the kernel's failure: one try, its job completed and never retried.
    expect(stopped.attempts).toBe(1);
    const jobs = await database.pool.query<{ state: string; retry_count: number }>(
      `select state, retry_count from pgboss_isolate_hang.job where name = 'trial.run' and (data->>'trialId')::int = $1`,
      [hog.trialId],
    );
    expect(jobs.rows).toEqual([{ state: 'completed', retry_count: 0 }]);
    expect(stuck).toEqual([]);
  }, 240_000);
});

describe('a heap hog that isolated-vm cannot stop, against the memory cap', () => {
  it("stops the trial when its process's memory passes the cap, long before the deadline", async () => {
    // The trial process holds about 260 MB after a trial; the hog adds about 100 MB a second.
    const trials = createTrialProcess({ deadlineMs: 120_000, memoryMb: 700 });
    try {
      const report = await trials.run({
        routine: 'lu-partial-pivoting',
        candidateSource: closureChainHog,
        setName: 'one',
        matrices: [generateMatrix({ family: 'uniform', n: 8, seed: 1 })],
        timingSizes: [],
        callTimeoutMs: 300,
        memoryLimitMb: 32,
      });
      expect(report.status).toBe('trial-failed');
      expect(report.message).toMatch(
        /^the trial was stopped when its process held \d+ MB, above its 700 MB cap: a kernel's memory grew past what its isolate's limit could stop \(in the accuracy phase, uniform-n8-s1, 0 of 1 done\)$/,
      );
    } finally {
      await trials.close();
    }
  }, 180_000);
});
