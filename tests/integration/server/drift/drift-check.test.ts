import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import { runDriftChecks } from '@server/drift/drift-checks.service.ts';
import { scheduleDriftChecks } from '@server/drift/drift-schedule.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import { DRIFT_JOB, type TrialQueue } from '@server/jobs/trial-queue.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import { createJobWorld, exampleSource, waitFor } from '../jobs/job-world.ts';
import { matrixRows, outboxTo, trialRow } from '../jobs/trial-readers.ts';
import { seedIncumbent } from './drift-world.ts';

const tinySet: MatrixSpec[] = [
  { family: 'uniform', n: 8, seed: 1 },
  { family: 'hilbert', n: 6 },
];
const sound = exampleSource('lu-partial-pivoting-right-looking');

/** A queue that only remembers what was put on it. */
function recordingQueue(): TrialQueue & { enqueued: number[] } {
  const enqueued: number[] = [];
  return { enqueued, enqueueTrial: async (id) => void enqueued.push(id), stop: async () => {} };
}

async function checkRow(database: Database, id: number) {
  const [row] = await database.db.select().from(driftChecks).where(eq(driftChecks.id, id));
  return row!;
}

describe('drift checks', () => {
  let database: Database;
  let queue: PgBossQueue;

  beforeAll(async () => {
    const databaseUrl = inject('databaseUrl');
    database = createDatabase(databaseUrl, 4);
    queue = await createPgBossQueue({
      databaseUrl,
      logger: pino({ level: 'silent' }),
      schema: 'pgboss_drift',
    });
    await startTrialWorker({
      boss: queue.boss,
      queue,
      db: database.db,
      env: loadEnv({}),
      logger: pino({ level: 'silent' }),
      limits: { callTimeoutMs: 5000, memoryLimitMb: 64 },
    });
  });

  afterAll(async () => {
    await queue?.boss.stop({ graceful: false, wait: true });
    await database?.pool.end();
  });

  it('records drift and alerts the maintainers when the snapshot claims a much faster time, and steady otherwise', async () => {
    const drifting = await createJobWorld(database.db, tinySet, [16]);
    await seedIncumbent(database.db, drifting, sound, {
      worstFactorRatio: 0.5,
      worstForwardErrorOverBound: 0.1,
      // An implausibly fast median at n = 16: the re-run is bound to be far slower.
      timing: [{ n: 16, medianMs: 1e-7, gflops: 2.7e4 }],
    });
    const steady = await createJobWorld(database.db, tinySet, [16]);
    await seedIncumbent(database.db, steady, sound, {
      worstFactorRatio: 0.5,
      worstForwardErrorOverBound: 0.1,
      timing: [{ n: 16, medianMs: 1e6, gflops: 1e-9 }],
    });

    const started = await runDriftChecks(database.db, queue, {
      routineIds: [drifting.routineId, steady.routineId],
    });
    expect(started.map((s) => s.routineId).sort()).toEqual(
      [drifting.routineId, steady.routineId].sort(),
    );

    const judged = (routineId: number) => {
      const check = started.find((s) => s.routineId === routineId)!;
      return waitFor(async () => {
        const row = await checkRow(database, check.driftCheckId);
        return row.status ? row : null;
      }, `the drift check of routine ${routineId}`);
    };
    const drifted = await judged(drifting.routineId);
    const calm = await judged(steady.routineId);

    expect(drifted.status).toBe('drifted');
    expect(drifted.alertOpen).toBe(true);
    expect(drifted.finishedAt).not.toBeNull();
    expect(drifted.findings.some((f) => f.includes('n = 16') && f.includes('slower'))).toBe(true);
    const alerts = await outboxTo(database.db, `${drifting.maintainer.login}@example.test`);
    expect(alerts.map((a) => a.kind)).toEqual(['drift-alert']);
    expect(alerts[0]!.textBody).toContain('n = 16');
    // Only maintainers are told.
    expect(await outboxTo(database.db, `${drifting.reviewer.login}@example.test`)).toHaveLength(0);

    // The re-run is a trial of the incumbent alone, with full results.
    const trial = await trialRow(database.db, drifted.trialId!);
    expect(trial.purpose).toBe('drift-check');
    expect(trial.incumbentRevisionId).toBeNull();
    expect(trial.status).toBe('completed');
    expect(await matrixRows(database.db, trial.id)).toHaveLength(tinySet.length);

    expect(calm.status).toBe('steady');
    expect(calm.alertOpen).toBe(false);
    expect(calm.findings).toEqual([]);
    expect(await outboxTo(database.db, `${steady.maintainer.login}@example.test`)).toHaveLength(0);
  });

  it('starts no second check while one is pending, and none without a promotion on record', async () => {
    const pending = await createJobWorld(database.db, tinySet, [16]);
    await seedIncumbent(database.db, pending, sound, {
      worstFactorRatio: 0.5,
      worstForwardErrorOverBound: null,
      timing: [],
    });
    const unpromoted = await createJobWorld(database.db, tinySet, [16]);
    await seedIncumbent(database.db, unpromoted, sound, null);
    const recording = recordingQueue();
    const routineIds = [pending.routineId, unpromoted.routineId];

    const first = await runDriftChecks(database.db, recording, { routineIds });
    expect(first.map((s) => s.routineId)).toEqual([pending.routineId]);
    expect(recording.enqueued).toEqual([first[0]!.trialId]);
    expect(await runDriftChecks(database.db, recording, { routineIds })).toEqual([]);
  });

  it('schedules drift.check on the configured cron', async () => {
    await scheduleDriftChecks(queue.boss, '15 4 * * *');
    const schedules = await queue.boss.getSchedules();
    expect(schedules.find((s) => s.name === DRIFT_JOB)?.cron).toBe('15 4 * * *');
  });
});
