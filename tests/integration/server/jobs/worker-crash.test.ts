import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createDatabase, type Database } from '@server/db/client.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import { createJobWorld, exampleSource, queueCandidateTrial, waitFor } from './job-world.ts';
import {
  candidateState,
  finishedTrial,
  matrixRows,
  timingRows,
  trialRow,
} from './trial-readers.ts';

const root = fileURLToPath(new URL('../../../../', import.meta.url));
const schema = 'pgboss_worker_crash';

// Large enough that the trial is still in its accuracy phase when the worker is killed.
const slowSet: MatrixSpec[] = [360, 380, 400, 420, 440, 460].map((n, i) => ({
  family: 'uniform',
  n,
  seed: i + 1,
}));

interface Child {
  process: ChildProcess;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  stderr: () => string;
}

/** `server/worker.ts` in a process of its own, as `npm run worker` starts it. */
function startWorker(databaseUrl: string): Child {
  const child = spawn(
    process.execPath,
    ['--no-node-snapshot', '--no-concurrent-recompilation', '--import', 'tsx', 'server/worker.ts'],
    {
      cwd: root,
      env: {
        ...process.env,
        DATABASE_URL: databaseUrl,
        PGBOSS_SCHEMA: schema,
        // Look for expired jobs every second, so the dead worker's job is retried soon after
        // its expiry.
        JOB_MAINTENANCE_SECONDS: '1',
        // Other test files' e-mail in this database is not this worker's to send.
        WORKER_SENDS_EMAIL: 'false',
        LOG_LEVEL: 'warn',
      },
      stdio: ['ignore', 'ignore', 'pipe'],
    },
  );
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.once('exit', (code, signal) => resolve({ code, signal })),
  );
  return { process: child, exited, stderr: () => stderr };
}

describe('a worker killed in the middle of a trial', () => {
  let database: Database;
  let queue: PgBossQueue;
  const children: Child[] = [];

  beforeAll(async () => {
    database = createDatabase(inject('databaseUrl'), 2);
    // The web side's queue: jobs expire 30 s after a worker took them (a trial here takes a few
    // seconds), then wait 1 s before the retry.
    queue = await createPgBossQueue({
      databaseUrl: inject('databaseUrl'),
      logger: pino({ level: 'silent' }),
      schema,
      trialJobs: { expireInSeconds: 30, retryDelaySeconds: 1, retryLimit: 2 },
    });
  });

  afterAll(async () => {
    for (const child of children) {
      if (child.process.exitCode === null && child.process.signalCode === null) {
        child.process.kill('SIGKILL');
        await child.exited;
      }
    }
    await queue?.boss.stop({ graceful: false, wait: true });
    await database?.pool.end();
  });

  it('is replaced by another worker, which writes exactly one complete set of results', async () => {
    const world = await createJobWorld(database.db, slowSet, [128]);
    const queued = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(queued.trialId);

    const first = startWorker(inject('databaseUrl'));
    children.push(first);
    const caught = await waitFor(
      async () => {
        const row = await trialRow(database.db, queued.trialId);
        return row.status === 'running' &&
          row.progress.phase === 'accuracy' &&
          row.progress.done >= 1
          ? row
          : null;
      },
      `the first worker to be in the accuracy phase (stderr: ${first.stderr()})`,
      120_000,
      50,
    );
    expect(caught.attempts).toBe(1);
    first.process.kill('SIGKILL');
    expect((await first.exited).signal).toBe('SIGKILL');

    // Results are only written at the end, so the killed try left none behind.
    const orphan = await trialRow(database.db, queued.trialId);
    expect(orphan.status).toBe('running');
    expect(await matrixRows(database.db, queued.trialId)).toHaveLength(0);

    const second = startWorker(inject('databaseUrl'));
    children.push(second);
    const trial = await finishedTrial(database.db, queued.trialId, 150_000);

    expect(trial.status).toBe('completed');
    expect(trial.attempts).toBe(2);
    const rows = await matrixRows(database.db, queued.trialId);
    expect(rows).toHaveLength(slowSet.length);
    expect(new Set(rows.map((r) => r.matrixId)).size).toBe(slowSet.length);
    expect(rows.map((r) => r.position)).toEqual(slowSet.map((_, i) => i));
    expect((await timingRows(database.db, queued.trialId)).map((t) => t.n)).toEqual([128]);
    expect(await candidateState(database.db, queued.candidateId)).toBe('in-review');

    // SIGTERM with nothing in hand: the worker stops cleanly.
    second.process.kill('SIGTERM');
    expect(await second.exited).toEqual({ code: 0, signal: null });
  }, 240_000);
});
