import type { Database } from '@server/db/client.ts';

/** One query of a read path with PostgreSQL's plan and execution time. */
export interface QueryPlan {
  name: string;
  executionMs: number | null;
  plan: string[];
}

/**
 * The queries behind GET /api/trials/:id and GET /api/routines/:id/logbook, written out as the
 * repos issue them (trials.repo.ts, promotions.repo.ts, logbook.repo.ts), under EXPLAIN
 * (ANALYZE, BUFFERS): where the time goes when a route misses its goal.
 */
const readPathQueries: { name: string; sql: string; param: 'trial' | 'routine' }[] = [
  {
    name: 'report: trial with its candidate',
    sql: `select t.*, r.candidate_id from trials t join revisions r on r.id = t.revision_id
          where t.id = $1 limit 1`,
    param: 'trial',
  },
  {
    name: 'report: per-matrix results',
    sql: `select * from trial_matrix_results where trial_id = $1 order by position, id`,
    param: 'trial',
  },
  {
    name: 'report: timing results',
    sql: `select * from trial_timing_results where trial_id = $1 order by n`,
    param: 'trial',
  },
  {
    name: 'logbook: promotions',
    sql: `select p.*, v.number, c.id, c.title, u.id, u.login, u.display_name
          from promotions p join revisions v on v.id = p.revision_id
          join candidates c on c.id = v.candidate_id join users u on u.id = p.promoted_by
          where p.routine_id = $1 order by p.created_at, p.id`,
    param: 'routine',
  },
  {
    name: 'logbook: drift checks',
    sql: `select * from drift_checks where routine_id = $1 order by created_at, id`,
    param: 'routine',
  },
];

export async function explainReadPaths(
  database: Database,
  trialId: number,
  routineId: number,
): Promise<QueryPlan[]> {
  const out: QueryPlan[] = [];
  for (const q of readPathQueries) {
    const result = await database.pool.query<{ 'QUERY PLAN': string }>(
      `explain (analyze, buffers) ${q.sql}`,
      [q.param === 'trial' ? trialId : routineId],
    );
    const plan = result.rows.map((r) => r['QUERY PLAN']);
    const time = plan.map((l) => /Execution Time: ([\d.]+) ms/.exec(l)).find((m) => m);
    out.push({ name: q.name, executionMs: time ? Number(time[1]) : null, plan });
  }
  return out;
}
