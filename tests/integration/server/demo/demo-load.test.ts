import { and, count, eq, inArray, isNotNull } from 'drizzle-orm';
import { CholeskyDecomposition, Matrix } from 'ml-matrix';
import pg from 'pg';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { candidateStates } from '@shared/states.ts';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { comments } from '@server/db/schema/comments.ts';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { matrixSetItems } from '@server/db/schema/matrix-sets.ts';
import { memberships } from '@server/db/schema/memberships.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { reviews } from '@server/db/schema/reviews.ts';
import { routines } from '@server/db/schema/routines.ts';
import { teams } from '@server/db/schema/teams.ts';
import { trialMatrixResults } from '@server/db/schema/trial-results.ts';
import { trials } from '@server/db/schema/trials.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import { users } from '@server/db/schema/users.ts';
import { loadDemo, type DemoLoadResult } from '@server/demo/demo-load.ts';

const silent = pino({ level: 'silent' });

/**
 * The demo loads only into an instance without teams, and the run's shared test database has
 * the teams of other test files; so this file makes and drops a database of its own.
 */
function databaseUrlNamed(base: string, name: string): string {
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}

async function adminQuery(base: string, text: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrlNamed(base, 'postgres') });
  await client.connect();
  try {
    await client.query(text);
  } finally {
    await client.end();
  }
}

describe('demo data', () => {
  const base = inject('databaseUrl');
  const name = `demo_${process.pid}_${Date.now()}`;
  let database: Database;
  let first: DemoLoadResult;

  beforeAll(async () => {
    await adminQuery(base, `create database "${name}"`);
    await migrateDatabase(databaseUrlNamed(base, name));
    database = createDatabase(databaseUrlNamed(base, name), 4);
    first = await loadDemo(database.db, loadEnv({}), { logger: silent });
  }, 240_000);

  afterAll(async () => {
    await database?.pool.end();
    await adminQuery(base, `drop database if exists "${name}" with (force)`);
  });

  it('loads one team of five people holding every role, one of them an instance admin', async () => {
    expect(first.loaded).toBe(true);
    const { db } = database;
    const [team] = await db.select().from(teams);
    const members = await db
      .select({ role: memberships.role, isAdmin: users.isAdmin })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, team!.id));
    expect(members).toHaveLength(5);
    expect(new Set(members.map((m) => m.role))).toEqual(
      new Set(['author', 'reviewer', 'maintainer']),
    );
    expect(members.filter((m) => m.isAdmin)).toHaveLength(1);
  });

  it('gives three routines an incumbent and at least two promotions each, every one resting on a real trial', async () => {
    const { db } = database;
    const rows = await db.select().from(routines);
    expect(rows).toHaveLength(3);
    for (const routine of rows) {
      expect(routine.incumbentRevisionId).not.toBeNull();
      const promoted = await db
        .select()
        .from(promotions)
        .where(eq(promotions.routineId, routine.id));
      expect(promoted.length).toBeGreaterThanOrEqual(2);
      for (const promotion of promoted) {
        expect(promotion.note.length).toBeGreaterThan(0);
        const [trial] = await db.select().from(trials).where(eq(trials.id, promotion.trialId));
        expect(trial).toMatchObject({ status: 'completed', passed: true, purpose: 'candidate' });
        const results = await db
          .select({ n: count() })
          .from(trialMatrixResults)
          .where(eq(trialMatrixResults.trialId, promotion.trialId));
        expect(results[0]!.n).toBeGreaterThan(0);
        // The snapshot comes from the trial's own measurements: real, positive times.
        for (const t of promotion.metricsSnapshot.timing) expect(t.medianMs).toBeGreaterThan(0);
      }
    }
    const reinstated = await db.select().from(promotions).where(eq(promotions.kind, 'reinstate'));
    expect(reinstated).toHaveLength(1);
  });

  it('has candidates in every state, with comments on lines and reviews with reasons', async () => {
    const { db } = database;
    const states = await db.selectDistinct({ state: candidates.state }).from(candidates);
    expect(new Set(states.map((s) => s.state))).toEqual(new Set(candidateStates));
    const onLines = await db.select().from(comments).where(isNotNull(comments.line));
    expect(onLines.length).toBeGreaterThan(0);
    const sentBack = await db.select().from(reviews).where(eq(reviews.verdict, 'send-back'));
    expect(sentBack.length).toBeGreaterThan(0);
    for (const review of sentBack) expect(review.body.trim().length).toBeGreaterThan(0);
  });

  it('stores the uploaded stiffness matrices as symmetric, positive definite and in the Cholesky set', async () => {
    const { db } = database;
    const files = await db.select().from(uploads);
    expect(files.length).toBeGreaterThan(0);
    for (const file of files) {
      expect(file).toMatchObject({ symmetry: 'symmetric', format: 'coordinate', field: 'real' });
      expect(file.rows).toBe(file.cols);
      const parsed = parseMatrixMarket(file.content);
      const n = parsed.n;
      for (let i = 0; i < n; i++)
        for (let j = 0; j < i; j++) expect(parsed.data[i * n + j]).toBe(parsed.data[j * n + i]);
      // A stiffness matrix assembled by the direct stiffness method from members that each add
      // a positive semidefinite element matrix, with enough supports to stop every rigid-body
      // motion, is symmetric positive definite (McGuire, Gallagher & Ziemian, Matrix Structural
      // Analysis, 2nd ed., §2.4 and ch. 4, from memory). Cholesky succeeding is the test:
      // ml-matrix's decomposition reports whether every pivot was positive.
      const rows = Array.from({ length: n }, (_, i) =>
        Array.from(parsed.data.subarray(i * n, i * n + n)),
      );
      expect(new CholeskyDecomposition(new Matrix(rows)).isPositiveDefinite()).toBe(true);
    }
    const [cholesky] = await db.select().from(routines).where(eq(routines.contract, 'cholesky'));
    const items = await db
      .select()
      .from(matrixSetItems)
      .where(
        and(
          eq(matrixSetItems.matrixSetId, cholesky!.matrixSetId),
          eq(matrixSetItems.kind, 'upload'),
        ),
      );
    expect(items.map((i) => i.uploadId).sort()).toEqual(files.map((f) => f.id).sort());
    const [incumbentPromotion] = await db
      .select()
      .from(promotions)
      .where(eq(promotions.revisionId, cholesky!.incumbentRevisionId!));
    const fileResults = await db
      .select()
      .from(trialMatrixResults)
      .where(
        and(
          eq(trialMatrixResults.trialId, incumbentPromotion!.trialId),
          eq(trialMatrixResults.family, 'file'),
        ),
      );
    expect(fileResults).toHaveLength(files.length);
    expect(fileResults.every((r) => r.passed)).toBe(true);
  });

  it('has a drift check that found the incumbent worse and opened an alert with its e-mail', async () => {
    const { db } = database;
    const drifted = await db
      .select()
      .from(driftChecks)
      .where(and(eq(driftChecks.status, 'drifted'), eq(driftChecks.alertOpen, true)));
    expect(drifted.length).toBeGreaterThanOrEqual(1);
    const check = drifted[0]!;
    expect(check.findings.length).toBeGreaterThan(0);
    const [trial] = await db.select().from(trials).where(eq(trials.id, check.trialId!));
    expect(trial).toMatchObject({ purpose: 'drift-check', status: 'completed' });
    const alerts = await db.select().from(emailOutbox).where(eq(emailOutbox.kind, 'drift-alert'));
    expect(alerts.length).toBeGreaterThanOrEqual(1);
  });

  it('gives the history its story times: promotions months apart, oldest first', async () => {
    const { db } = database;
    const rows = await db.select().from(promotions).orderBy(promotions.id);
    const times = rows.map((p) => p.createdAt.getTime());
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    expect(times[times.length - 1]! - times[0]!).toBeGreaterThan(30 * 24 * 3_600_000);
  });

  it('does nothing on a second load', async () => {
    const { db } = database;
    const before = await db.select({ n: count() }).from(candidates);
    const second = await loadDemo(db, loadEnv({}), { logger: silent });
    expect(second.loaded).toBe(false);
    const teamCount = await db.select({ n: count() }).from(teams);
    const after = await db.select({ n: count() }).from(candidates);
    expect(teamCount[0]!.n).toBe(1);
    expect(after[0]!.n).toBe(before[0]!.n);
  });

  it('leaves the queued trial of the candidate on trial for the worker', async () => {
    if (!first.loaded) throw new Error('the first load did not happen');
    expect(first.queuedTrialIds).toHaveLength(1);
    const queued = await database.db
      .select()
      .from(trials)
      .where(inArray(trials.id, first.queuedTrialIds));
    expect(queued[0]!.status).toBe('queued');
  });
});
