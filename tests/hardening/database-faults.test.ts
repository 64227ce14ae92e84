import { inArray } from 'drizzle-orm';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { submissionSchema } from '@shared/api/candidates.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { trials } from '@server/db/schema/trials.ts';
import { type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { type RunningApp } from '@tests/helpers/test-app.ts';
import { createFreshDatabase } from '@tests/integration/server/auth/oauth-flow.ts';
import {
  createJobWorld,
  waitFor,
  type JobWorld,
} from '@tests/integration/server/jobs/job-world.ts';
import { suiteTally } from '@tests/hardening/suite-tally.ts';
import { startAppWithWorker } from '@tests/helpers/app-with-worker.ts';

// PostgreSQL drops every connection of the app's database while the web server and a trial
// worker run (pg_terminate_backend on a private database: what a server restart does to its
// clients, without stopping the cluster others use). Requests meanwhile must fail cleanly, and
// both must recover without a restart of their own.
const tally = suiteTally('database faults', 'recovered');
let fresh: { url: string; drop: () => Promise<void> };
let app: RunningApp;
let queue: PgBossQueue;
let world: JobWorld;
const kernel = readKernelSource('starters/lu-partial-pivoting.ts');

async function dropConnections(url: string): Promise<number> {
  const admin = new URL(url);
  const name = admin.pathname.slice(1);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const res = await client.query(
      'select pg_terminate_backend(pid) from pg_stat_activity where datname = $1 and pid <> pg_backend_pid()',
      [name],
    );
    return res.rowCount ?? 0;
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  fresh = await createFreshDatabase(inject('databaseUrl'));
  ({ app, queue } = await startAppWithWorker(fresh.url));
  world = await createJobWorld(app.database.db, [{ family: 'uniform', n: 6, seed: 1 }], []);
}, 120_000);

afterAll(async () => {
  tally.print();
  await queue?.boss.stop({ graceful: false, wait: true });
  await app?.close();
  await fresh?.drop();
});

const submit = (title: string) =>
  fetch(`${app.url}/api/routines/${world.routineId}/candidates`, {
    method: 'POST',
    headers: world.author.headers,
    body: JSON.stringify({ title, source: kernel }),
  });

async function trialOf(candidateId: number) {
  const db = app.database.db;
  const [revision] = await db
    .select()
    .from(revisions)
    .where(inArray(revisions.candidateId, [candidateId]));
  const rows = await db
    .select()
    .from(trials)
    .where(inArray(trials.revisionId, [revision!.id]));
  return rows;
}

describe('PostgreSQL dropping every connection', () => {
  it('answers cleanly meanwhile, then reads, submissions and trials work again', async () => {
    tally.tried();
    // Warm the pools, so there are connections to lose.
    expect((await fetch(`${app.url}/api/me`, { headers: world.author.headers })).status).toBe(200);
    expect(await dropConnections(fresh.url)).toBeGreaterThan(0);

    // Meanwhile: every answer is a success or an error in the one shape, never a hang or a crash.
    for (let i = 0; i < 10; i++) {
      const res = await fetch(`${app.url}/api/me`, { headers: world.author.headers });
      if (res.status !== 200) {
        expect(res.status).toBeGreaterThanOrEqual(500);
        apiErrorSchema.parse(await res.json());
      } else await res.arrayBuffer();
    }

    const me = await waitFor(
      async () =>
        (await fetch(`${app.url}/api/me`, { headers: world.author.headers })).status === 200,
      'the web server to read again',
      30_000,
      250,
    );
    expect(me).toBe(true);
    const res = await submit('After the drop');
    expect(res.status).toBe(201);
    const { candidate } = submissionSchema.parse(await res.json());
    const id = candidate.id;
    const done = await waitFor(
      async () => {
        const rows = await trialOf(id);
        return rows.length === 1 && rows[0]!.status === 'completed' ? rows : null;
      },
      'the worker to finish the trial submitted after the drop',
      90_000,
      500,
    );
    expect(done).toHaveLength(1);
    tally.held();
  }, 150_000);
});
