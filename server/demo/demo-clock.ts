import { sql } from 'drizzle-orm';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import type { DemoMoment } from './demo-story.ts';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** The time of a moment of the story: `day` whole days before `anchor`, at `hour`:00 UTC. */
export function momentTime(anchor: Date, moment: DemoMoment): Date {
  const day = new Date(anchor.getTime() - moment.day * DAY_MS);
  day.setUTCHours(moment.hour, 0, 0, 0);
  return day;
}

interface TimestampColumn {
  table: string;
  column: string;
}

/**
 * Gives the demo's rows the times of its story. The whole load runs in one transaction, in which
 * PostgreSQL's now() is the transaction's start, so every timestamp a step writes (column
 * defaults and the services' `now()` alike) equals now(); after each step those are moved to the
 * step's moment. Rows of earlier steps already hold earlier times and are left alone. A trial
 * ends its measured duration after its start (phases.totalMs), so the logbook shows real
 * durations.
 */
export async function createDemoClock(tx: DbOrTx) {
  const { rows } = await tx.execute<{ table_name: string; column_name: string }>(sql`
    select table_name, column_name from information_schema.columns
    where table_schema = 'public' and data_type = 'timestamp with time zone'
    order by table_name, column_name`);
  const columns: TimestampColumn[] = rows.map((r) => ({
    table: r.table_name,
    column: r.column_name,
  }));
  let last = 0;

  return {
    /** Moves every timestamp written since the previous stamp to `when` (which must not go back). */
    async stamp(when: Date): Promise<void> {
      if (when.getTime() < last) throw new RangeError('the demo clock cannot go back in time');
      last = when.getTime();
      const at = when.toISOString();
      for (const { table, column } of columns) {
        const target = sql.identifier(column);
        const value =
          table === 'trials' && column === 'finished_at'
            ? sql`${at}::timestamptz + coalesce((phases->>'totalMs')::float8, 0) * interval '1 millisecond'`
            : sql`${at}::timestamptz`;
        await tx.execute(
          sql`update ${sql.identifier(table)} set ${target} = ${value} where ${target} = now()`,
        );
      }
    },
  };
}

export type DemoClock = Awaited<ReturnType<typeof createDemoClock>>;
