import { eq } from 'drizzle-orm';
import { namedSet, type MatrixSet } from '@sandbox/matrices/sets.ts';
import { createDatabase } from '@server/db/client.ts';
import { candidates } from '@server/db/schema/candidates.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { routines } from '@server/db/schema/routines.ts';
import { sourceHash } from '@server/revisions/revision-submission.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fmt } from './measure.ts';
import { createBenchDatabase } from './service/bench-database.ts';
import { freePort, runLoad, startApp, type StartedProcess } from './service/child-processes.ts';
import type { LoadResult } from './service/load-spec.ts';
import { measureQueue, type QueueRun } from './service/queue-throughput.ts';
import { explainReadPaths } from './service/read-path-plans.ts';
import { seedHistory } from './service/seed-history.ts';
import { seedLuRoutine, seedMatrixSet, seedTeam } from './service/seed-team.ts';
import { incumbentSource, runTemplateTrials } from './service/seed-templates.ts';

/**
 * The service under load: a throw-away database with a year of history (10 000 trials with
 * their per-matrix and timing rows, promotions, daily drift checks), the app in its own process,
 * and autocannon in a third one sending GET /api/trials/:id and GET /api/routines/:id/logbook
 * at 1, 10 and 50 connections. Then the queue: 1, 2 and 4 worker processes draining quick-set
 * trials. Everything started is stopped, and the database dropped, even on failure.
 */

interface Size {
  routines: number;
  people: number;
  trialsPerRoutine: number;
  driftChecksPerRoutine: number;
  promotionsPerRoutine: number;
  /** The seeded routines' matrix set, whose real trials the seeded ones copy. */
  set: MatrixSet;
  templateTimingBudgetMs: number;
  connections: number[];
  durationSeconds: number;
  warmUpSeconds: number;
  workers: number[];
  queueTrials: number;
  queueTimeoutMs: number;
  /** Worker settings beyond the defaults (smoke: a short timing budget). */
  workerEnv: Record<string, string>;
}

const full: Size = {
  routines: 4,
  people: 8,
  trialsPerRoutine: 2500,
  driftChecksPerRoutine: 365,
  promotionsPerRoutine: 12,
  set: namedSet('standard'),
  templateTimingBudgetMs: 150,
  connections: [1, 10, 50],
  durationSeconds: 10,
  warmUpSeconds: 3,
  workers: [1, 2, 4],
  queueTrials: 12,
  queueTimeoutMs: 10 * 60_000,
  workerEnv: {},
};

const smoke: Size = {
  routines: 1,
  people: 2,
  trialsPerRoutine: 50,
  driftChecksPerRoutine: 10,
  promotionsPerRoutine: 2,
  set: { ...namedSet('quick'), timingSizes: [16] },
  templateTimingBudgetMs: 20,
  connections: [1],
  durationSeconds: 1,
  warmUpSeconds: 0,
  workers: [1],
  queueTrials: 1,
  queueTimeoutMs: 120_000,
  workerEnv: { TRIAL_TIMING_BUDGET_MS: '20' },
};

const routineTitles = [
  'Frame solver: LU of tangent stiffness',
  'Bridge deck: LU of influence matrices',
  'Crane boom: LU of load cases',
  'Facade panels: LU of thermal coupling',
];

interface LoadRun extends LoadResult {
  /** `me` (GET /api/me) is the baseline: the same middleware and token check, a small answer. */
  route: 'me' | 'report' | 'logbook';
  connections: number;
  /** The app process's CPU time over the run per answered request (null without /proc). */
  appCpuMsPerRequest: number | null;
}

async function getJson(
  url: string,
  token: string,
): Promise<{ status: number; bytes: number; body: unknown }> {
  const res = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
  const text = await res.text();
  return { status: res.status, bytes: Buffer.byteLength(text), body: JSON.parse(text) };
}

export const serviceBenchmark: Benchmark = {
  name: 'service',
  description:
    'Trial report and logbook routes under autocannon (second process) with 10 000 seeded trials at 1, 10 and 50 connections; queue throughput with 1, 2 and 4 workers on the quick set.',
  async run({ smoke: isSmoke, log }) {
    const size = isSmoke ? smoke : full;
    const checks: BenchmarkCheck[] = [];
    const bench = await createBenchDatabase();
    const database = createDatabase(bench.url, 4);
    let app: StartedProcess | null = null;
    try {
      // Seeding: the team, the set, the routines; two real trials; the history copied from them.
      let t0 = performance.now();
      const team = await seedTeam(database.db, size.people);
      const setId = await seedMatrixSet(database.db, team, size.set, `Structures ${size.set.name}`);
      const routineIds: number[] = [];
      for (let r = 0; r < size.routines; r++) {
        routineIds.push(
          await seedLuRoutine(database.db, team, setId, `lu-${r + 1}`, routineTitles[r % 4]!),
        );
      }
      const templates = await runTemplateTrials(size.set, size.templateTimingBudgetMs);
      const templateSeconds = (performance.now() - t0) / 1000;
      checks.push({
        name: 'template trials completed',
        passed:
          templates.candidate.status === 'completed' &&
          templates.driftCheck.status === 'completed' &&
          templates.candidate.matrices.length > 0 &&
          templates.driftCheck.matrices.length === templates.candidate.matrices.length,
        detail: `${templates.candidate.status}/${templates.driftCheck.status}, ${templates.candidate.matrices.length} matrices`,
      });
      t0 = performance.now();
      const history = await seedHistory(
        database,
        {
          routineIds,
          matrixSetId: setId,
          authorIds: team.people.filter((p) => p.role === 'author').map((p) => p.user.id),
          maintainerId: team.maintainer.id,
          trialsPerRoutine: size.trialsPerRoutine,
          driftChecksPerRoutine: size.driftChecksPerRoutine,
          promotionsPerRoutine: size.promotionsPerRoutine,
          days: 365,
        },
        templates,
      );
      const seedSeconds = (performance.now() - t0) / 1000;
      const c = history.counts;
      log(`  seeded in ${fmt(templateSeconds)} s + ${fmt(seedSeconds)} s: ${JSON.stringify(c)}`);
      const plannedTrials = size.routines * size.trialsPerRoutine;
      const perTrialRows = templates.candidate.matrices.length;
      checks.push({
        name: `${plannedTrials} trials seeded with their result rows`,
        passed:
          c.trials === plannedTrials &&
          c.matrixRows === history.completedTrialIds.length * perTrialRows &&
          c.timingRows === history.completedTrialIds.length * size.set.timingSizes.length &&
          c.promotions === size.routines * size.promotionsPerRoutine &&
          c.driftChecks === size.routines * size.driftChecksPerRoutine,
        detail: JSON.stringify(c),
      });

      // The app in its own process; one request of each route checked by hand first.
      const port = await freePort(3300, 3319);
      t0 = performance.now();
      app = await startApp(bench.url, port);
      const appStartSeconds = (performance.now() - t0) / 1000;
      log(`  app ready in ${fmt(appStartSeconds)} s`);
      const url = `http://127.0.0.1:${port}`;
      const tokens = team.people.map((p) => p.token);
      const sampleTrial = history.completedTrialIds[history.completedTrialIds.length - 1]!;
      const report = await getJson(`${url}/api/trials/${sampleTrial}`, tokens[0]!);
      const reportBody = report.body as { matrices?: unknown[]; timing?: unknown[] };
      checks.push({
        name: 'a seeded trial report is served in full',
        passed:
          report.status === 200 &&
          reportBody.matrices?.length === perTrialRows &&
          reportBody.timing?.length === size.set.timingSizes.length,
        detail: `status ${report.status}, ${reportBody.matrices?.length} matrices, ${report.bytes} bytes`,
      });
      const logbook = await getJson(`${url}/api/routines/${routineIds[0]}/logbook`, tokens[0]!);
      const logbookBody = logbook.body as { promotions?: unknown[]; driftChecks?: unknown[] };
      checks.push({
        name: 'a seeded logbook is served in full',
        passed:
          logbook.status === 200 &&
          logbookBody.promotions?.length === size.promotionsPerRoutine &&
          logbookBody.driftChecks?.length === size.driftChecksPerRoutine,
        detail: `status ${logbook.status}, ${logbookBody.promotions?.length} promotions, ${logbookBody.driftChecks?.length} drift checks, ${logbook.bytes} bytes`,
      });

      const routes: Record<LoadRun['route'], { pathTemplate: string; ids: number[] }> = {
        report: { pathTemplate: '/api/trials/{id}', ids: history.trialIds },
        logbook: { pathTemplate: '/api/routines/{id}/logbook', ids: routineIds },
        me: { pathTemplate: '/api/me', ids: [team.maintainer.id] },
      };
      const load = (route: LoadRun['route'], connections: number, seconds: number) =>
        runLoad({ url, tokens, connections, durationSeconds: seconds, ...routes[route] });
      if (size.warmUpSeconds > 0) {
        await load('report', 10, size.warmUpSeconds);
        await load('logbook', 10, size.warmUpSeconds);
      }
      // Side by side: each connection count runs both routes, one after the other; then the
      // baseline at the top count.
      const runs: LoadRun[] = [];
      const top = Math.max(...size.connections);
      const plan = [
        ...size.connections.flatMap((connections) =>
          (['report', 'logbook'] as const).map((route) => ({ route, connections })),
        ),
        // The baseline only in full runs: it measures nothing in a smoke run.
        ...(isSmoke ? [] : [{ route: 'me' as const, connections: top }]),
      ];
      for (const { route, connections } of plan) {
        const cpuBefore = app.cpuMs();
        const result = await load(route, connections, size.durationSeconds);
        const cpuAfter = app.cpuMs();
        const appCpuMsPerRequest =
          cpuBefore === null || cpuAfter === null || result.requests === 0
            ? null
            : (cpuAfter - cpuBefore) / result.requests;
        runs.push({ route, connections, appCpuMsPerRequest, ...result });
        log(
          `  ${route} c=${connections}: ${fmt(result.perSecond)} req/s, p50 ${fmt(result.ms.p50)} p95 ${fmt(result.ms.p95)} p99 ${fmt(result.ms.p99)} ms, app CPU ${fmt(appCpuMsPerRequest)} ms per request`,
        );
      }
      checks.push({
        name: 'every request under load answered 2xx',
        passed: runs.every((r) => r.non2xx === 0 && r.errors === 0 && r.requests > 0),
        detail: runs
          .map(
            (r) =>
              `${r.route} c=${r.connections}: ${r.requests} ok, ${r.non2xx} non-2xx, ${r.errors} errors`,
          )
          .join('; '),
      });
      const plans = isSmoke ? null : await explainReadPaths(database, sampleTrial, routineIds[0]!);
      await app.stop();
      app = null;

      // The queue: a routine on the quick set with the starter as its incumbent.
      const quickSetId = await seedMatrixSet(
        database.db,
        team,
        namedSet('quick'),
        'Queue run quick',
      );
      const queueRoutineId = await seedLuRoutine(
        database.db,
        team,
        quickSetId,
        'lu-queue',
        'Queue run: LU',
      );
      const [starter] = await database.db
        .insert(candidates)
        .values({
          routineId: queueRoutineId,
          authorId: team.maintainer.id,
          title: 'Starter LU',
          state: 'promoted',
        })
        .returning();
      const [starterRevision] = await database.db
        .insert(revisions)
        .values({
          candidateId: starter!.id,
          number: 1,
          source: incumbentSource,
          sourceHash: sourceHash(incumbentSource),
          diagnostics: [],
          createdBy: team.maintainer.id,
        })
        .returning();
      await database.db
        .update(routines)
        .set({ incumbentRevisionId: starterRevision!.id })
        .where(eq(routines.id, queueRoutineId));
      const queueRuns: QueueRun[] = [];
      t0 = performance.now();
      for (const workers of size.workers) {
        const run = await measureQueue(
          database,
          bench.url,
          {
            routineId: queueRoutineId,
            matrixSetId: quickSetId,
            incumbentRevisionId: starterRevision!.id,
            authorId: team.people[1]?.user.id ?? team.maintainer.id,
          },
          workers,
          size.queueTrials,
          size.queueTimeoutMs,
          size.workerEnv,
        );
        queueRuns.push(run);
        log(
          `  queue ${workers} worker(s): ${fmt(run.perMinute)} trials/min, ${JSON.stringify(run.statuses)}; workers started in ${fmt(run.startSeconds)} s`,
        );
      }
      const queueSeconds = (performance.now() - t0) / 1000;
      checks.push({
        name: 'every queued trial completed',
        passed: queueRuns.every((r) => r.statuses.completed === r.trials),
        detail: queueRuns
          .map((r) => `${r.workers} worker(s): ${JSON.stringify(r.statuses)}`)
          .join('; '),
      });

      const at = (route: LoadRun['route'], connections: number) =>
        runs.find((r) => r.route === route && r.connections === connections) ?? null;
      const perMinute = (workers: number) =>
        queueRuns.find((r) => r.workers === workers)?.perMinute ?? null;
      return {
        checks,
        goals: [
          goal(
            `trial report p95 at ${top} connections, ms`,
            at('report', top)?.ms.p95 ?? null,
            'max',
            50,
          ),
          goal(
            `logbook p95 at ${top} connections, ms`,
            at('logbook', top)?.ms.p95 ?? null,
            'max',
            100,
          ),
        ],
        summary: [
          [
            'seeded',
            `${c.trials} trials (${c.matrixRows} matrix rows, ${c.timingRows} timing rows), ${c.promotions} promotions, ${c.driftChecks} drift checks in ${fmt(templateSeconds + seedSeconds)} s`,
          ],
          [
            'payloads',
            `report ${fmt(report.bytes / 1024)} KiB, logbook ${fmt(logbook.bytes / 1024)} KiB`,
          ],
          ...runs.map((r): [string, string] => [
            `${r.route} c=${r.connections}`,
            `${fmt(r.perSecond)} req/s; p50 ${fmt(r.ms.p50)}, p95 ${fmt(r.ms.p95)}, p99 ${fmt(r.ms.p99)} ms; app CPU ${fmt(r.appCpuMsPerRequest)} ms/request`,
          ]),
          ...(['report', 'logbook'] as const).map((route): [string, string] => {
            const cpu = at(route, top)?.appCpuMsPerRequest ?? null;
            return [
              `${route}: one free core`,
              cpu === null
                ? 'no /proc: CPU per request not measured'
                : `at most ${fmt(1000 / cpu)} req/s from the app's CPU alone, so ${top} connections wait at least ${fmt(top * cpu)} ms each (Little's law)`,
            ];
          }),
          ...queueRuns.map((r): [string, string] => [
            `queue ${r.workers} worker(s)`,
            `${fmt(r.perMinute)} trials/min (${r.trials} in ${fmt(r.seconds)} s; after warm-up ${fmt(r.steadyPerMinute)})${
              perMinute(1) && r.workers > 1
                ? `, ×${fmt(r.perMinute / perMinute(1)!)} one worker`
                : ''
            }`,
          ]),
        ],
        data: {
          size: { ...size, set: size.set.name },
          seeding: { templateSeconds, seedSeconds, counts: c },
          appStartSeconds,
          queueSeconds,
          payloadBytes: { report: report.bytes, logbook: logbook.bytes },
          runs,
          queueRuns,
          plans,
        },
      };
    } finally {
      await app?.stop().catch(() => {});
      await database.pool.end().catch(() => {});
      await bench.drop();
    }
  },
};
