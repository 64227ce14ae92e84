import { createHash } from 'node:crypto';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { createPgBossQueue, type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { startTrialWorker } from '@server/jobs/trial-worker.ts';
import { TRIAL_JOB } from '@server/jobs/trial-queue.ts';
import { notifyTrialFinished } from '@server/trials/trial-notifications.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import {
  createJobWorld,
  exampleSource,
  queueCandidateTrial,
  waitFor,
  type JobWorld,
} from './job-world.ts';
import {
  candidateState,
  finishedTrial,
  matrixRows,
  outboxTo,
  timingRows,
  trialRow,
} from './trial-readers.ts';

// A real pg-boss worker in this process, in a pg-boss schema of its own so that other test
// files sharing the database never see these jobs.
const tinySet: MatrixSpec[] = [
  { family: 'uniform', n: 8, seed: 1 },
  { family: 'hilbert', n: 6 },
  { family: 'diagonally-dominant', n: 10, seed: 2 },
  { family: 'singular', n: 6 },
];

describe('the trial worker', () => {
  let database: Database;
  let queue: PgBossQueue;
  let world: JobWorld;
  // Trials whose final transaction fails this many more times (a planted harness fault).
  const sabotaged = new Map<number, number>();

  beforeAll(async () => {
    const databaseUrl = inject('databaseUrl');
    database = createDatabase(databaseUrl, 4);
    queue = await createPgBossQueue({
      databaseUrl,
      logger: pino({ level: 'silent' }),
      schema: 'pgboss_trial_worker',
      trialJobs: { retryDelaySeconds: 1 },
    });
    await startTrialWorker({
      boss: queue.boss,
      queue,
      db: database.db,
      env: loadEnv({}),
      logger: pino({ level: 'silent' }),
      // A short call limit so that the endless loop is stopped quickly.
      limits: { callTimeoutMs: 300, memoryLimitMb: 64 },
      notify: async (tx, trialId, env) => {
        const left = sabotaged.get(trialId) ?? 0;
        if (left > 0) {
          sabotaged.set(trialId, left - 1);
          throw new Error('planted fault: insert into email_outbox failed');
        }
        return notifyTrialFinished(tx, trialId, env);
      },
    });
    world = await createJobWorld(database.db, tinySet, [16]);
  });

  afterAll(async () => {
    await queue?.boss.stop({ graceful: false, wait: true });
    await database?.pool.end();
  });

  it('completes a sound kernel: one result row per matrix, timing at n = 16, candidate in review', async () => {
    const queued = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(queued.trialId);
    const trial = await finishedTrial(database.db, queued.trialId);

    expect(trial.status).toBe('completed');
    expect(trial.attempts).toBe(1);
    expect(trial.passed).toBe(true);
    expect(trial.verdict?.passed).toBe(true);
    expect(trial.machine?.isolatedVmVersion).toBeTruthy();
    expect(trial.phases?.totalMs).toBeGreaterThan(0);
    expect(trial.progress.phase).toBe('done');
    expect(trial.finishedAt).not.toBeNull();

    const matrices = await matrixRows(database.db, queued.trialId);
    expect(matrices.map((m) => m.matrixId)).toEqual([
      'uniform-n8-s1',
      'hilbert-n6',
      'diagonally-dominant-n10-s2',
      'singular-n6',
    ]);
    expect(matrices.map((m) => m.candidate.status)).toEqual(['ok', 'ok', 'ok', 'threw']);
    expect(matrices.every((m) => m.passed)).toBe(true);
    // κ of a singular matrix is Infinity, kept as such in its double precision column.
    expect(matrices[3]!.condition).toBe(Infinity);
    const timing = await timingRows(database.db, queued.trialId);
    expect(timing.map((t) => t.n)).toEqual([16]);
    expect(timing[0]!.candidateMs).toBeGreaterThan(0);

    expect(await candidateState(database.db, queued.candidateId)).toBe('in-review');
    // notifyTrialFinished ran in the final transaction: the reviewer has "awaits review".
    const mail = await outboxTo(database.db, `${world.reviewer.login}@example.test`);
    expect(mail.map((m) => m.kind)).toContain('awaits-review');
  });

  it('ends an endless loop as trial-failed with timeouts, then completes the next trial', async () => {
    const endless = await queueCandidateTrial(database.db, world, exampleSource('lu-endless-loop'));
    const sound = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(endless.trialId);
    await queue.enqueueTrial(sound.trialId);

    const failed = await finishedTrial(database.db, endless.trialId);
    expect(failed.status).toBe('trial-failed');
    expect(failed.passed).toBe(false);
    expect(failed.message).toContain('timeout');
    const rows = await matrixRows(database.db, endless.trialId);
    expect(rows.length).toBeGreaterThan(0);
    expect(new Set(rows.map((r) => r.candidate.status))).toEqual(new Set(['timeout']));
    expect(await candidateState(database.db, endless.candidateId)).toBe('trial-failed');

    const next = await finishedTrial(database.db, sound.trialId);
    expect(next.status).toBe('completed');
    expect(await matrixRows(database.db, sound.trialId)).toHaveLength(tinySet.length);
  });

  it('ends a memory hog as trial-failed with out-of-memory results, then completes the next trial', async () => {
    const hog = await queueCandidateTrial(database.db, world, exampleSource('lu-memory-hog'));
    const sound = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(hog.trialId);
    await queue.enqueueTrial(sound.trialId);

    const trial = await finishedTrial(database.db, hog.trialId);
    expect(trial.status).toBe('trial-failed');
    const rows = await matrixRows(database.db, hog.trialId);
    expect(rows[0]!.candidate.status).toBe('out-of-memory');
    expect(await candidateState(database.db, hog.candidateId)).toBe('trial-failed');

    // The isolate that ran out of memory took nothing of the worker with it.
    const next = await finishedTrial(database.db, sound.trialId);
    expect(next.status).toBe('completed');
    expect(next.passed).toBe(true);
    const nextRows = await matrixRows(database.db, sound.trialId);
    expect(nextRows.map((r) => r.candidate.status)).toEqual(['ok', 'ok', 'ok', 'threw']);
    expect(await candidateState(database.db, sound.candidateId)).toBe('in-review');
  });

  it('changes nothing when a completed trial is delivered again', async () => {
    const queued = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(queued.trialId);
    const before = await finishedTrial(database.db, queued.trialId);
    const rowsBefore = await matrixRows(database.db, queued.trialId);

    const jobId = await queue.boss.send(TRIAL_JOB, { trialId: queued.trialId });
    const job = await waitFor(async () => {
      const found = await queue.boss.getJobById(TRIAL_JOB, jobId!);
      return found?.state === 'completed' ? found : null;
    }, 'the repeated job to complete');
    expect(job.output).toMatchObject({ trialId: queued.trialId, outcome: 'already-finished' });

    const after = await trialRow(database.db, queued.trialId);
    expect(after.attempts).toBe(before.attempts);
    expect(after.finishedAt).toEqual(before.finishedAt);
    expect((await matrixRows(database.db, queued.trialId)).map((r) => r.id)).toEqual(
      rowsBefore.map((r) => r.id),
    );
  });

  it('ends a trial whose set holds an unreadable upload as trial-failed, without retries', async () => {
    const broken = await createJobWorld(
      database.db,
      [
        { family: 'uniform', n: 8, seed: 1 },
        { fileName: 'bay-frame.mtx', content: 'not a matrix' },
      ],
      [16],
    );
    const queued = await queueCandidateTrial(
      database.db,
      broken,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    await queue.enqueueTrial(queued.trialId);
    const trial = await finishedTrial(database.db, queued.trialId);
    expect(trial.status).toBe('trial-failed');
    expect(trial.attempts).toBe(1);
    expect(trial.message).toContain('bay-frame.mtx');
    expect(await matrixRows(database.db, queued.trialId)).toHaveLength(0);
    expect(await candidateState(database.db, queued.candidateId)).toBe('trial-failed');
  });

  it('retries a harness fault, then marks the trial errored after the last try', async () => {
    const queued = await queueCandidateTrial(
      database.db,
      world,
      exampleSource('lu-partial-pivoting-right-looking'),
    );
    const tries = queue.trialJobs.retryLimit + 1;
    sabotaged.set(queued.trialId, tries);
    await queue.enqueueTrial(queued.trialId);
    const trial = await finishedTrial(database.db, queued.trialId);

    expect(trial.status).toBe('errored');
    expect(trial.attempts).toBe(tries);
    expect(sabotaged.get(queued.trialId)).toBe(0);
    // The team sees plain words, not the error's text (which could carry SQL).
    expect(trial.message).toContain('fault of the service');
    expect(trial.message).not.toContain('email_outbox');
    expect(await matrixRows(database.db, queued.trialId)).toHaveLength(0);
    expect(await candidateState(database.db, queued.candidateId)).toBe('trial-failed');
  });

  it('leaves the candidate on trial when its trial is of an older revision', async () => {
    const source = exampleSource('lu-partial-pivoting-right-looking');
    const queued = await queueCandidateTrial(database.db, world, source);
    // A newer revision arrived before the worker took the older one's trial.
    await database.db.insert(revisions).values({
      candidateId: queued.candidateId,
      number: 2,
      source,
      sourceHash: createHash('sha256').update(`${source}\n`).digest('hex'),
      diagnostics: [],
      createdBy: world.author.id,
    });
    await queue.enqueueTrial(queued.trialId);
    expect((await finishedTrial(database.db, queued.trialId)).status).toBe('completed');
    expect(await candidateState(database.db, queued.candidateId)).toBe('on-trial');
  });
});
