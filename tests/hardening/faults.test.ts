import { randomUUID } from 'node:crypto';
import { inArray, sql } from 'drizzle-orm';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { submissionSchema } from '@shared/api/candidates.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { loadEnv } from '@server/config/env.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { trials } from '@server/db/schema/trials.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { TRIAL_JOB } from '@server/jobs/trial-queue.ts';
import { enqueueEmail, startOutboxSender } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { type RunningApp } from '@tests/helpers/test-app.ts';
import {
  createJobWorld,
  queueCandidateTrial,
  waitFor,
  type JobWorld,
} from '@tests/integration/server/jobs/job-world.ts';
import { matrixRows } from '@tests/integration/server/jobs/trial-readers.ts';
import { createPrivateDatabase } from '@tests/integration/server/mail/private-database.ts';
import { startPrivateCluster, type PrivateCluster } from '@tests/hardening/private-cluster.ts';
import { suiteTally } from '@tests/hardening/suite-tally.ts';
import { startAppWithWorker } from '@tests/helpers/app-with-worker.ts';

// Faults injected while the service runs, each counted as recovered only when its last check
// passes: PostgreSQL restarted under the web server and a trial worker (a cluster of this file's
// own, so the shared one keeps running), and the SMTP server down while the outbox sends.
const tally = suiteTally('faults', 'recovered');
const kernel = readKernelSource('starters/lu-partial-pivoting.ts');
const matrixSet = [
  { family: 'uniform' as const, n: 120, seed: 1 },
  { family: 'uniform' as const, n: 160, seed: 2 },
  { family: 'uniform' as const, n: 200, seed: 3 },
];
/** Longest any single request may take while the database is away. */
const requestLimitMs = 5_000;

afterAll(() => tally.print());

describe('PostgreSQL restarted under the web server and a worker', () => {
  let cluster: PrivateCluster | undefined;
  let app: RunningApp | undefined;
  let queue: PgBossQueue | undefined;
  let world: JobWorld;

  beforeAll(async () => {
    cluster = await startPrivateCluster({ from: 54500, to: 54520 });
    const url = await cluster.createDatabase('faults');
    await migrateDatabase(url);
    ({ app, queue } = await startAppWithWorker(url));
    world = await createJobWorld(app.database.db, matrixSet, []);
  }, 60_000);

  afterAll(async () => {
    await queue?.boss.stop({ graceful: false, wait: true }).catch(() => {});
    await app?.close().catch(() => {});
    await cluster?.destroy();
  }, 30_000);

  const get = (path: string) =>
    fetch(`${app!.url}${path}`, {
      headers: world.author.headers,
      signal: AbortSignal.timeout(requestLimitMs),
    });
  const submit = (title: string) =>
    fetch(`${app!.url}/api/routines/${world.routineId}/candidates`, {
      method: 'POST',
      headers: world.author.headers,
      body: JSON.stringify({ title, source: kernel }),
      signal: AbortSignal.timeout(requestLimitMs),
    });

  /** A success, or an error of the server's in the one shape; a hang fails the fetch. */
  async function expectCleanAnswer(res: Response) {
    if (res.status < 300) {
      await res.arrayBuffer();
      return;
    }
    expect(res.status).toBeGreaterThanOrEqual(500);
    expect(apiErrorSchema.safeParse(await res.json()).success).toBe(true);
  }

  async function submitted(title: string): Promise<number> {
    const res = await submit(title);
    expect(res.status).toBe(201);
    return submissionSchema.parse(await res.json()).candidate.id;
  }

  async function trialsOf(candidateId: number) {
    const db = app!.database.db;
    const revs = await db
      .select()
      .from(revisions)
      .where(inArray(revisions.candidateId, [candidateId]));
    return db
      .select()
      .from(trials)
      .where(
        inArray(
          trials.revisionId,
          revs.map((r) => r.id),
        ),
      );
  }

  async function expectCompletedOnce(candidateId: number, what: string) {
    const done = await waitFor(
      async () => {
        const rows = await trialsOf(candidateId).catch(() => null);
        return rows && rows.every((r) => r.status === 'completed') && rows.length > 0 ? rows : null;
      },
      what,
      40_000,
      250,
    );
    expect(done).toHaveLength(1);
    const results = await matrixRows(app!.database.db, done[0]!.id);
    expect(results).toHaveLength(matrixSet.length);
    expect(new Set(results.map((r) => r.matrixId)).size).toBe(matrixSet.length);
  }

  it('answers cleanly during the outage, then reads, submits and finishes every trial once', async () => {
    tally.tried();
    expect((await get('/api/me')).status).toBe(200);
    // Trials in hand when the database goes away: one running (the worker runs one at a time)
    // and one queued, its job due only after the outage so the worker cannot have taken it.
    const running = await submitted('Running at the restart');
    await waitFor(
      async () => (await trialsOf(running))[0]?.status === 'running',
      'the worker to start the first trial',
      20_000,
      20,
    );
    const queued = await queueCandidateTrial(app!.database.db, world, kernel);
    const jobId = await queue!.boss.send(
      TRIAL_JOB,
      { trialId: queued.trialId },
      { retryLimit: 2, retryDelay: 1, expireInSeconds: 600, startAfter: 4 },
    );
    expect(jobId).not.toBeNull();
    expect((await trialsOf(running))[0]?.status).toBe('running');
    expect((await trialsOf(queued.candidateId))[0]?.status).toBe('queued');

    await cluster!.stop();
    const outageEnds = Date.now() + 2_000;
    let refused = 0;
    while (Date.now() < outageEnds) {
      for (const res of [await get('/api/me'), await submit('During the outage')]) {
        if (res.status >= 500) refused += 1;
        await expectCleanAnswer(res);
      }
    }
    // The outage was seen: the server answered with errors, not with stale successes only.
    expect(refused).toBeGreaterThan(0);
    await cluster!.start();

    await waitFor(
      async () => (await get('/api/me').catch(() => null))?.status === 200,
      'the web server to read again',
      20_000,
      250,
    );
    const fresh = await submitted('After the restart');

    await expectCompletedOnce(running, 'the trial running at the restart to complete');
    await expectCompletedOnce(queued.candidateId, 'the trial queued at the restart to complete');
    await expectCompletedOnce(fresh, 'the trial submitted after the restart to complete');
    tally.held();
  }, 90_000);
});

describe('SMTP server down while the outbox sends', () => {
  let privateDb: Awaited<ReturnType<typeof createPrivateDatabase>> | undefined;
  let fake: FakeSmtpServer | undefined;
  let sender: { stop(): Promise<void> } | undefined;

  afterAll(async () => {
    await sender?.stop();
    await fake?.close();
    await privateDb?.drop();
  });

  it('retries and delivers every message exactly once when the server is back', async () => {
    tally.tried();
    privateDb = await createPrivateDatabase(inject('databaseUrl'));
    const { db } = privateDb.open(4);
    fake = await startFakeSmtpServer({ port: 0, host: '127.0.0.1' });
    const port = fake.port;
    sender = startOutboxSender({
      db,
      transport: createMailTransport(loadEnv({ SMTP_PORT: String(port) })),
      intervalMs: 50,
      logger: pino({ level: 'silent' }),
    });

    await fake.close();
    fake = undefined;
    const tag = randomUUID().slice(0, 8);
    const subjects = Array.from(
      { length: 6 },
      (_, i) => `Hallbrook & Vey LU drift ${tag} #${i + 1}`,
    );
    for (const subject of subjects) {
      await enqueueEmail(db, {
        kind: 'awaits-review',
        to: 'ines.probst@hallbrook-vey.example',
        subject,
        text: subject,
        html: `<p>${subject}</p>`,
      });
    }
    // Every message has failed at least once against the missing server.
    await waitFor(
      async () => {
        const rows = await db.select().from(emailOutbox);
        return (
          rows.length === subjects.length && rows.every((r) => r.attempts >= 1 && r.sentAt === null)
        );
      },
      'the sender to fail on every message',
      15_000,
      50,
    );

    fake = await startFakeSmtpServer({ port, host: '127.0.0.1' });
    // Time passes: the retries come due.
    await db.update(emailOutbox).set({ nextAttemptAt: sql`now() - interval '1 second'` });
    await waitFor(
      async () => (await db.select().from(emailOutbox)).every((r) => r.sentAt !== null),
      'the sender to deliver every message',
      15_000,
      50,
    );
    // A few more rounds of the sender: nothing is sent twice.
    await new Promise((resolve) => setTimeout(resolve, 500));
    await sender.stop();
    sender = undefined;
    expect(
      fake
        .messages()
        .map((m) => m.subject)
        .sort(),
    ).toEqual([...subjects].sort());
    tally.held();
  }, 45_000);
});
