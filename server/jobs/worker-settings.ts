import { z } from 'zod';

/**
 * Settings only the worker reads, beside the shared ones in config/env.ts: the limits a trial's
 * kernels run under, the pg-boss schema and how often pg-boss looks for expired jobs. Parsed
 * once at start-up with the same fail-fast message as loadEnv.
 */
const workerSettingsSchema = z.object({
  /** Schema pg-boss keeps its tables in; the web process and the workers must agree on it. */
  PGBOSS_SCHEMA: z
    .string()
    .regex(/^[a-z_][a-z0-9_]{0,62}$/)
    .default('pgboss'),
  /** Longest single kernel call before the isolate stops it. */
  TRIAL_CALL_TIMEOUT_MS: z.coerce.number().int().min(50).max(600_000).default(10_000),
  /** Heap limit of each kernel's isolate. */
  TRIAL_MEMORY_LIMIT_MB: z.coerce.number().int().min(16).max(4096).default(256),
  /** Time budget per timing size (both kernels together); the engine's default when unset. */
  TRIAL_TIMING_BUDGET_MS: z.coerce.number().int().min(0).max(600_000).optional(),
  /**
   * How often pg-boss's maintenance runs: it turns jobs whose worker died (active past their
   * expiry) into retries. A dead worker's trial is retried within expiry + this.
   */
  JOB_MAINTENANCE_SECONDS: z.coerce.number().int().min(1).max(3600).default(60),
  /** Whether this worker also drains the e-mail outbox (off when another process does). */
  WORKER_SENDS_EMAIL: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  /** On SIGTERM/SIGINT, how long the current trial may run on before it is abandoned. */
  WORKER_STOP_GRACE_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
});

export type WorkerSettings = z.infer<typeof workerSettingsSchema>;

export function loadWorkerSettings(source: NodeJS.ProcessEnv = process.env): WorkerSettings {
  const parsed = workerSettingsSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid worker settings:\n  ${problems.join('\n  ')}`);
  }
  return parsed.data;
}
