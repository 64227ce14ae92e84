import { performance } from 'node:perf_hooks';
import { inArray, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { candidates } from '@server/db/schema/candidates.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { trialMatrixResults } from '@server/db/schema/trial-results.ts';
import { trials } from '@server/db/schema/trials.ts';
import { type PgBossQueue } from '@server/jobs/pg-boss-queue.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { quantileSorted } from '@sandbox/stats/quantiles.ts';
import { type RunningApp } from '@tests/helpers/test-app.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';
import {
  createJobWorld,
  waitFor,
  type JobWorld,
} from '@tests/integration/server/jobs/job-world.ts';
import { startAppWithWorker } from '@tests/helpers/app-with-worker.ts';

// 50 submissions at once from 10 people, against the app on a loopback port with one trial
// worker (pg-boss, in this process, in a schema of its own). A tiny matrix set and no timing
// keep each trial short. The p95 of a read route during the burst is reported, not asserted.
const people = 10;
const perPerson = 5;
const kernel = readKernelSource('starters/lu-partial-pivoting.ts');

let app: RunningApp;
let queue: PgBossQueue;
let world: JobWorld;
let authors: TestUser[];

beforeAll(async () => {
  const databaseUrl = inject('databaseUrl');
  ({ app, queue } = await startAppWithWorker(databaseUrl, { schema: 'pgboss_hardening_load' }));
  world = await createJobWorld(
    app.database.db,
    [
      { family: 'uniform', n: 6, seed: 1 },
      { family: 'diagonally-dominant', n: 5, seed: 2 },
    ],
    [],
  );
  authors = [];
  for (let i = 0; i < people; i++) {
    const user = await createTestUser(app.database.db);
    await app.database.db
      .insert(memberships)
      .values({ teamId: world.teamId, userId: user.id, role: 'author' });
    authors.push(user);
  }
}, 120_000);

afterAll(async () => {
  await queue?.boss.stop({ graceful: false, wait: true });
  await app?.close();
});

describe('a burst of submissions', () => {
  it('queues all 50, completes each trial once with one result per matrix, and keeps reads answering', async () => {
    const db = app.database.db;
    const submit = (user: TestUser, k: number) =>
      fetch(`${app.url}/api/routines/${world.routineId}/candidates`, {
        method: 'POST',
        headers: user.headers,
        body: JSON.stringify({ title: `Burst ${user.login} #${k}`, source: kernel }),
      });

    // Reads during the burst: the routine's candidate list, as the reviewer would poll it.
    const latencies: number[] = [];
    const readStatuses: number[] = [];
    let bursting = true;
    const reader = (async () => {
      while (bursting) {
        const t0 = performance.now();
        const res = await fetch(`${app.url}/api/routines/${world.routineId}/candidates`, {
          headers: world.reviewer.headers,
        });
        await res.arrayBuffer();
        latencies.push(performance.now() - t0);
        readStatuses.push(res.status);
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
    })();

    const answers = await Promise.all(
      authors.flatMap((user) => Array.from({ length: perPerson }, (_, k) => submit(user, k))),
    );
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 201)).toHaveLength(people * perPerson);

    const mine = await db
      .select({ id: candidates.id })
      .from(candidates)
      .where(sql`${candidates.routineId} = ${world.routineId}`);
    expect(mine).toHaveLength(people * perPerson);
    const revisionIds = (
      await db
        .select({ id: revisions.id })
        .from(revisions)
        .where(
          inArray(
            revisions.candidateId,
            mine.map((c) => c.id),
          ),
        )
    ).map((r) => r.id);
    expect(revisionIds).toHaveLength(people * perPerson);

    const finished = await waitFor(
      async () => {
        const rows = await db
          .select({ id: trials.id, status: trials.status, revisionId: trials.revisionId })
          .from(trials)
          .where(inArray(trials.revisionId, revisionIds));
        const done = rows.filter((r) => r.status !== 'queued' && r.status !== 'running');
        return done.length === revisionIds.length ? rows : null;
      },
      'every trial of the burst to finish',
      240_000,
      500,
    );
    bursting = false;
    await reader;

    // One trial per revision, each completed, each with one result row per matrix.
    expect(new Set(finished.map((t) => t.revisionId)).size).toBe(revisionIds.length);
    expect(finished.map((t) => t.status)).toEqual(finished.map(() => 'completed'));
    const results = await db
      .select({ trialId: trialMatrixResults.trialId, n: sql<number>`count(*)::int` })
      .from(trialMatrixResults)
      .where(
        inArray(
          trialMatrixResults.trialId,
          finished.map((t) => t.id),
        ),
      )
      .groupBy(trialMatrixResults.trialId);
    expect(results).toHaveLength(finished.length);
    expect(results.every((r) => r.n === 2)).toBe(true);
    const duplicated = finished.length - new Set(finished.map((t) => t.revisionId)).size;

    expect(readStatuses.length).toBeGreaterThan(0);
    expect(readStatuses.every((s) => s === 200)).toBe(true);
    const sorted = [...latencies].sort((a, b) => a - b);
    console.log(
      `load: ${answers.length} submitted / ${finished.filter((t) => t.status === 'completed').length} completed / ${duplicated} duplicated; ` +
        `reads during the burst: ${latencies.length}, p50 ${quantileSorted(sorted, 0.5).toFixed(1)} ms, ` +
        `p95 ${quantileSorted(sorted, 0.95).toFixed(1)} ms, max ${sorted.at(-1)!.toFixed(1)} ms`,
    );
  }, 300_000);
});
