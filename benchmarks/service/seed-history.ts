import { eq, inArray } from 'drizzle-orm';
import type { TrialReport } from '@shared/trial-report.ts';
import type { Database } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { driftChecks } from '@server/db/schema/drift-checks.ts';
import { promotions } from '@server/db/schema/promotions.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { trials } from '@server/db/schema/trials.ts';
import { forJsonb, insertTrialResults } from '@server/jobs/trial-result-rows.ts';
import { metricsSnapshot } from '@server/promotions/metrics-snapshot.ts';
import { sourceHash } from '@server/revisions/revision-submission.ts';
import { candidateSource, incumbentSource, type TrialTemplates } from './seed-templates.ts';

/** How much history each routine gets. */
export interface HistoryPlan {
  routineIds: number[];
  matrixSetId: number;
  authorIds: number[];
  maintainerId: number;
  /** Trials per routine, drift checks' re-runs included. */
  trialsPerRoutine: number;
  driftChecksPerRoutine: number;
  promotionsPerRoutine: number;
  /** The history ends now and starts this many days ago. */
  days: number;
}

export interface SeededHistory {
  /** Every seeded trial, oldest first per routine. */
  trialIds: number[];
  /** The trials that have per-matrix and timing rows (completed ones). */
  completedTrialIds: number[];
  counts: {
    candidates: number;
    revisions: number;
    trials: number;
    matrixRows: number;
    timingRows: number;
    promotions: number;
    driftChecks: number;
  };
}

type TrialInsert = typeof trials.$inferInsert;
type Kind = 'candidate' | 'drift-check';

const REVISIONS_PER_CANDIDATE = 3;
/** Trials of revisions 1, 2, 3 of a candidate: the last one is re-run once. */
const TRIALS_OF_REVISION = [1, 1, 2];
/** Every this many candidate trials, one could not run (a type error): no result rows. */
const FAILED_EVERY = 23;
const CHUNK = 500;
const DAY = 86_400_000;

function chunks<T>(rows: readonly T[], size = CHUNK): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < rows.length; i += size) out.push(rows.slice(i, i + size));
  return out;
}

/** Multi-row INSERTs of `CHUNK` rows, returning the new ids in insertion order. */
async function insertIds<T>(rows: T[], insert: (chunk: T[]) => Promise<{ id: number }[]>) {
  const ids: number[] = [];
  for (const chunk of chunks(rows)) {
    const got = await insert(chunk);
    ids.push(...got.map((r) => r.id).sort((a, b) => a - b));
  }
  return ids;
}

function trialFields(report: TrialReport, at: Date, failed: boolean) {
  const finishedAt = new Date(at.getTime() + 60_000 + report.phases.totalMs);
  const common = { attempts: 1, createdAt: at, startedAt: new Date(at.getTime() + 2_000) };
  if (failed) {
    return {
      ...common,
      status: 'trial-failed' as const,
      progress: { phase: 'done' as const, done: 0, total: 0 },
      passed: false,
      message: 'The candidate did not pass the type check against the contract.',
      finishedAt: common.startedAt,
    };
  }
  const total = report.matrices.length;
  return {
    ...common,
    status: 'completed' as const,
    progress: { phase: 'done' as const, done: total, total },
    machine: forJsonb(report.machine),
    phases: forJsonb(report.phases),
    verdict: forJsonb(report.verdict),
    passed: report.verdict.passed,
    message: report.message ?? null,
    finishedAt,
  };
}

/**
 * Copies the template trials' result rows to every other completed trial in one statement per
 * chunk, inside the database (INSERT … SELECT over unnest of the id pairs): no row travels
 * through this process, and every copy has the size and shape of a real trial's rows.
 */
async function copyResultRows(database: Database, pairs: { trialId: number; from: number }[]) {
  for (const chunk of chunks(pairs, 1000)) {
    const params = [chunk.map((p) => p.trialId), chunk.map((p) => p.from)];
    await database.pool.query(
      `insert into trial_matrix_results (trial_id, position, matrix_id, family, m, n, condition,
         condition_kind, expected, reference_growth, reference_trusted, note, candidate,
         incumbent, passed, failures)
       select c.trial_id, r.position, r.matrix_id, r.family, r.m, r.n, r.condition,
         r.condition_kind, r.expected, r.reference_growth, r.reference_trusted, r.note,
         r.candidate, r.incumbent, r.passed, r.failures
       from unnest($1::int[], $2::int[]) as c(trial_id, template_id)
       join trial_matrix_results r on r.trial_id = c.template_id`,
      params,
    );
    await database.pool.query(
      `insert into trial_timing_results (trial_id, n, rounds, candidate_ms, incumbent_ms, ratio,
         ci_low, ci_high, verdict, detail)
       select c.trial_id, r.n, r.rounds, r.candidate_ms, r.incumbent_ms, r.ratio, r.ci_low,
         r.ci_high, r.verdict, r.detail
       from unnest($1::int[], $2::int[]) as c(trial_id, template_id)
       join trial_timing_results r on r.trial_id = c.template_id`,
      params,
    );
  }
}

interface RoutineHistory {
  trialIds: number[];
  completed: { id: number; kind: Kind }[];
  candidates: number;
  revisions: number;
  promotions: number;
  driftChecks: number;
}

/**
 * One routine's year: candidates of three revisions each (the last re-run once), every
 * `FAILED_EVERY`-th candidate trial failed, promotions at evenly spaced candidates (the first
 * one the starter kernel), and a drift check with its re-run trial at even intervals after the
 * first promotion, each against the promotion then in office.
 */
async function seedRoutine(
  database: Database,
  plan: HistoryPlan,
  routineId: number,
  templates: TrialTemplates,
): Promise<RoutineHistory> {
  const db = database.db;
  const start = Date.now() - plan.days * DAY;
  const span = plan.days * DAY;
  const candidateTrials = plan.trialsPerRoutine - plan.driftChecksPerRoutine;
  const trialsPerCandidate = TRIALS_OF_REVISION.reduce((s, v) => s + v, 0);
  const count = Math.max(1, Math.ceil(candidateTrials / trialsPerCandidate));
  // Candidates arrive over the first 95 % of the year; promotions at evenly spaced ones.
  const candidateAt = (c: number) => start + (c / count) * span * 0.95;
  const promoted = new Set<number>();
  for (let p = 0; p < plan.promotionsPerRoutine; p++) {
    promoted.add(Math.floor((p * count) / plan.promotionsPerRoutine));
  }

  const candidateIds = await insertIds(
    Array.from({ length: count }, (_, c) => ({
      routineId,
      authorId: plan.authorIds[c % plan.authorIds.length]!,
      title: c === 0 ? 'Starter LU with partial pivoting' : `Right-looking LU, variant ${c}`,
      description: 'Row-oriented right-looking elimination with partial pivoting.',
      state: promoted.has(c) ? ('promoted' as const) : ('returned' as const),
      createdAt: new Date(candidateAt(c)),
      updatedAt: new Date(candidateAt(c) + DAY),
    })),
    (chunk) => db.insert(candidates).values(chunk).returning({ id: candidates.id }),
  );
  const revisionRows = candidateIds.flatMap((candidateId, c) =>
    Array.from({ length: REVISIONS_PER_CANDIDATE }, (_, r) => {
      const source = c === 0 ? incumbentSource : `${candidateSource}\n// revision ${r + 1}\n`;
      return {
        candidateId,
        number: r + 1,
        source,
        sourceHash: sourceHash(source),
        diagnostics: [],
        createdBy: plan.authorIds[c % plan.authorIds.length]!,
        createdAt: new Date(candidateAt(c) + r * 6 * 3_600_000),
      };
    }),
  );
  const revisionIds = await insertIds(revisionRows, (chunk) =>
    db.insert(revisions).values(chunk).returning({ id: revisions.id }),
  );

  // Promotions happen a day after the promoted candidate's last revision; the incumbent of a
  // candidate trial is the revision promoted last before it.
  const promotionPlan = [...promoted]
    .sort((a, b) => a - b)
    .map((c) => ({
      c,
      revisionIndex: c * REVISIONS_PER_CANDIDATE + REVISIONS_PER_CANDIDATE - 1,
      at: candidateAt(c) + DAY,
    }));
  const incumbentAt = (t: number): number | null => {
    let found: number | null = null;
    for (const p of promotionPlan) if (p.at <= t) found = revisionIds[p.revisionIndex]!;
    return found;
  };

  const trialRows: (TrialInsert & { kind: Kind })[] = [];
  const lastTrialOfRevision = new Map<number, number>();
  let made = 0;
  for (let i = 0; i < revisionRows.length && made < candidateTrials; i++) {
    const r = i % REVISIONS_PER_CANDIDATE;
    for (let k = 0; k < TRIALS_OF_REVISION[r]! && made < candidateTrials; k++) {
      const at = new Date(revisionRows[i]!.createdAt.getTime() + 300_000 + k * 3_600_000);
      made += 1;
      lastTrialOfRevision.set(i, trialRows.length);
      trialRows.push({
        kind: 'candidate',
        routineId,
        revisionId: revisionIds[i]!,
        incumbentRevisionId: incumbentAt(at.getTime()),
        matrixSetId: plan.matrixSetId,
        purpose: 'candidate',
        ...trialFields(templates.candidate, at, made % FAILED_EVERY === 0),
      });
    }
  }
  // Drift checks from the first promotion to now, against the promotion then in office.
  const firstPromotion = promotionPlan[0]?.at ?? start;
  const driftAt = (d: number) =>
    firstPromotion + DAY + (d / plan.driftChecksPerRoutine) * (Date.now() - firstPromotion - DAY);
  const driftOffice: number[] = [];
  for (let d = 0; d < plan.driftChecksPerRoutine; d++) {
    const at = driftAt(d);
    const office = Math.max(0, promotionPlan.filter((p) => p.at <= at).length - 1);
    driftOffice.push(office);
    trialRows.push({
      kind: 'drift-check',
      routineId,
      revisionId: revisionIds[promotionPlan[office]?.revisionIndex ?? 0]!,
      incumbentRevisionId: null,
      matrixSetId: plan.matrixSetId,
      purpose: 'drift-check',
      ...trialFields(templates.driftCheck, new Date(at), false),
    });
  }
  const trialIds = await insertIds(trialRows, (chunk) =>
    db
      .insert(trials)
      .values(chunk.map(({ kind: _kind, ...row }) => row))
      .returning({ id: trials.id }),
  );

  const snapshot = metricsSnapshot(templates.candidate.matrices, templates.candidate.timing);
  const promotionIds = await insertIds(
    promotionPlan.map((p, i) => {
      // A failed trial cannot be promoted on; the revision's last trial is a completed one
      // unless the failure cadence hit it, in which case its earlier trial is used.
      let t = lastTrialOfRevision.get(p.revisionIndex) ?? 0;
      if (trialRows[t]?.status !== 'completed' && t > 0) t -= 1;
      return {
        routineId,
        revisionId: revisionIds[p.revisionIndex]!,
        trialId: trialIds[t]!,
        previousRevisionId: i === 0 ? null : revisionIds[promotionPlan[i - 1]!.revisionIndex]!,
        kind: 'promote' as const,
        promotedBy: plan.maintainerId,
        note: i === 0 ? 'The starter kernel goes into service.' : 'Cleared by two sign-offs.',
        metricsSnapshot: forJsonb(snapshot),
        createdAt: new Date(p.at),
      };
    }),
    (chunk) => db.insert(promotions).values(chunk).returning({ id: promotions.id }),
  );
  const driftTrialOffset = trialRows.length - plan.driftChecksPerRoutine;
  if (promotionIds.length > 0) {
    await insertIds(
      driftOffice.map((office, d) => {
        const drifted = d % 40 === 39;
        const trial = trialRows[driftTrialOffset + d]!;
        return {
          routineId,
          promotionId: promotionIds[office]!,
          trialId: trialIds[driftTrialOffset + d]!,
          status: drifted ? ('drifted' as const) : ('steady' as const),
          findings: drifted ? ['n = 512: median time 14 % above the promotion snapshot'] : [],
          summary: drifted ? 'Slower at n = 512 than when promoted.' : 'Steady.',
          alertOpen: drifted && d > plan.driftChecksPerRoutine - 40,
          createdAt: trial.createdAt!,
          finishedAt: trial.finishedAt!,
        };
      }),
      (chunk) => db.insert(driftChecks).values(chunk).returning({ id: driftChecks.id }),
    );
    const last = promotionPlan[promotionPlan.length - 1]!;
    await db
      .update(routines)
      .set({ incumbentRevisionId: revisionIds[last.revisionIndex]! })
      .where(eq(routines.id, routineId));
  }
  // The newest few candidates are still waiting for reviewers.
  const waiting = candidateIds.filter((_, c) => c >= count - 3 && !promoted.has(c));
  if (waiting.length > 0) {
    await db.update(candidates).set({ state: 'in-review' }).where(inArray(candidates.id, waiting));
  }
  return {
    trialIds,
    completed: trialIds
      .map((id, i) => ({ id, kind: trialRows[i]!.kind, status: trialRows[i]!.status }))
      .filter((t) => t.status === 'completed')
      .map(({ id, kind }) => ({ id, kind })),
    candidates: count,
    revisions: revisionIds.length,
    promotions: promotionIds.length,
    driftChecks: promotionIds.length > 0 ? plan.driftChecksPerRoutine : 0,
  };
}

/**
 * Seeds each routine's history with bulk INSERTs, then gives the first completed trial of each
 * kind its real result rows (the worker's own insertTrialResults) and copies them to the rest.
 */
export async function seedHistory(
  database: Database,
  plan: HistoryPlan,
  templates: TrialTemplates,
): Promise<SeededHistory> {
  const histories: RoutineHistory[] = [];
  for (const routineId of plan.routineIds) {
    histories.push(await seedRoutine(database, plan, routineId, templates));
  }
  const completed = histories.flatMap((h) => h.completed);
  const templateOf = new Map<Kind, number>();
  for (const kind of ['candidate', 'drift-check'] as const) {
    const first = completed.find((t) => t.kind === kind);
    if (!first) continue;
    templateOf.set(kind, first.id);
    const report = kind === 'candidate' ? templates.candidate : templates.driftCheck;
    await insertTrialResults(database.db, first.id, report);
  }
  await copyResultRows(
    database,
    completed
      .filter((t) => templateOf.get(t.kind) !== t.id)
      .map((t) => ({ trialId: t.id, from: templateOf.get(t.kind)! })),
  );
  await database.pool.query('analyze');
  const counted = await database.pool.query<{ m: string; t: string }>(
    `select (select count(*) from trial_matrix_results) as m,
            (select count(*) from trial_timing_results) as t`,
  );
  const sum = (key: keyof RoutineHistory) =>
    histories.reduce((s, h) => s + (typeof h[key] === 'number' ? (h[key] as number) : 0), 0);
  return {
    trialIds: histories.flatMap((h) => h.trialIds),
    completedTrialIds: completed.map((t) => t.id),
    counts: {
      candidates: sum('candidates'),
      revisions: sum('revisions'),
      trials: histories.reduce((s, h) => s + h.trialIds.length, 0),
      matrixRows: Number(counted.rows[0]!.m),
      timingRows: Number(counted.rows[0]!.t),
      promotions: sum('promotions'),
      driftChecks: sum('driftChecks'),
    },
  };
}
