import type PgBoss from 'pg-boss';
import { DRIFT_JOB } from '@server/jobs/trial-queue.ts';

/**
 * Schedules `drift.check` on `cron` (DRIFT_CHECK_CRON, read in UTC). pg-boss keeps schedules in
 * its tables and sends each due job once however many workers run; scheduling again replaces
 * the cron expression. The queue must exist first (createPgBossQueue makes it).
 */
export async function scheduleDriftChecks(boss: PgBoss, cron: string): Promise<void> {
  await boss.schedule(DRIFT_JOB, cron, {}, { tz: 'UTC' });
}
