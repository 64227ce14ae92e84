import type pg from 'pg';
import type { Health } from '@shared/api/health.ts';
import { appVersion } from '../config/version.ts';

/** Reports whether the database answers within a short time. */
export async function checkHealth(pool: pg.Pool, timeoutMs = 2000): Promise<Health> {
  const up = await Promise.race([
    pool.query('select 1').then(
      () => true,
      () => false,
    ),
    new Promise<boolean>((resolve) => setTimeout(resolve, timeoutMs, false).unref()),
  ]);
  return { ok: up, db: up ? 'up' : 'down', version: appVersion };
}
