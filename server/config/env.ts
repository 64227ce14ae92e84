import { z } from 'zod';

/** The built-in session secret: fine on a developer's machine, refused in production. */
export const developmentSessionSecret = 'development-only-session-secret';

const envFields = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  /** The address people use to reach the app; links in e-mail point here. */
  PUBLIC_URL: z.url().optional(),
  DATABASE_URL: z.url().default('postgres://postgres@127.0.0.1:54329/stablehand'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIR: z.string().optional(),
  /** Signs session cookies; production needs one of its own (see the check below). */
  SESSION_SECRET: z.string().min(16).default(developmentSessionSecret),
  /** OAuth client of the GitHub-compatible provider (the local fake in development and tests). */
  GITHUB_CLIENT_ID: z.string().default('stablehand-local'),
  GITHUB_CLIENT_SECRET: z.string().default('stablehand-local-secret'),
  GITHUB_AUTHORIZE_URL: z.url().default('http://127.0.0.1:3002/login/oauth/authorize'),
  GITHUB_TOKEN_URL: z.url().default('http://127.0.0.1:3002/login/oauth/access_token'),
  GITHUB_PROFILE_URL: z.url().default('http://127.0.0.1:3002/user'),
  /** Port of the local fake OAuth provider started by npm start (0 = do not start it). */
  FAKE_GITHUB_PORT: z.coerce.number().int().min(0).max(65535).default(3002),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  /** Port of the local fake SMTP server started by npm start (0 = do not start it). */
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  /** Port of the fake SMTP server's JSON reader (on SMTP_HOST); the development mailbox reads it. */
  FAKE_SMTP_HTTP_PORT: z.coerce.number().int().min(1).max(65535).default(2526),
  /**
   * Whether /api/dev/mailbox shows what the fake SMTP server captured: on by default except in
   * production; npm start turns it on, since it runs the fake SMTP server beside the app.
   */
  MAILBOX: z.enum(['on', 'off']).optional(),
  MAIL_FROM: z.string().default('Stablehand <stablehand@localhost>'),
  /** Cron expression for drift checks of every incumbent (pg-boss schedule). */
  DRIFT_CHECK_CRON: z.string().default('0 3 * * *'),
  /** Schema pg-boss keeps its tables in; the web process and the workers must agree on it. */
  PGBOSS_SCHEMA: z
    .string()
    .regex(/^[a-z_][a-z0-9_]{0,62}$/)
    .default('pgboss'),

  /** Rate limits (server/auth/rate-limits.ts): the window, and requests allowed in it; 0 = off. */
  RATE_LIMIT_WINDOW_SECONDS: z.coerce.number().int().min(1).max(86_400).default(60),
  /** Sign-in starts and callbacks per client address. */
  RATE_LIMIT_SIGN_IN: z.coerce.number().int().min(0).default(60),
  /** Requests with a refused API token per client address. */
  RATE_LIMIT_TOKEN_FAILURES: z.coerce.number().int().min(0).default(60),
  /** New candidates and revisions per person. */
  RATE_LIMIT_SUBMISSIONS: z.coerce.number().int().min(0).default(120),

  // The worker's settings (server/worker.ts); the web process ignores them.
  /** Longest single kernel call before the isolate stops it. */
  TRIAL_CALL_TIMEOUT_MS: z.coerce.number().int().min(50).max(600_000).default(10_000),
  /**
   * Heap limit of each kernel's isolate; the engine's own default (sandbox/isolate/limits.ts), so a
   * trial in the worker judges a memory-hungry kernel as the evaluator does.
   */
  TRIAL_MEMORY_LIMIT_MB: z.coerce.number().int().min(16).max(4096).default(128),
  /** Time budget per timing size (both kernels together); the engine's default when unset. */
  TRIAL_TIMING_BUDGET_MS: z.coerce.number().int().min(0).max(600_000).optional(),
  /**
   * Wall-clock limit for one whole trial in the worker's trial process, after which the process
   * is killed and the trial fails (a kernel that no limit of its isolate stops). Below the trial
   * job's 30-minute expiry, so that the trial is recorded before pg-boss would try it again.
   */
  TRIAL_DEADLINE_SECONDS: z.coerce.number().int().min(5).max(1500).default(900),
  /** Memory cap of the worker's trial process (resident set, and its JavaScript heap). */
  TRIAL_PROCESS_MEMORY_MB: z.coerce.number().int().min(256).max(65_536).default(2048),
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

const envSchema = envFields.superRefine((env, ctx) => {
  // Anyone who has read this repository knows the built-in secret and could forge session
  // cookies with it, so production refuses to start on it.
  if (env.NODE_ENV === 'production' && env.SESSION_SECRET === developmentSessionSecret) {
    ctx.addIssue({
      code: 'custom',
      path: ['SESSION_SECRET'],
      message:
        'production needs a secret of its own (at least 16 characters, for example from `openssl rand -hex 32`); the built-in development secret is public',
    });
  }
});

export type Env = z.infer<typeof envSchema>;

/** Parses the environment once at start-up and fails fast with every problem listed. */
export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n  ${problems.join('\n  ')}`);
  }
  return parsed.data;
}

/** The public base URL, defaulting to the listening address. */
export function publicUrl(env: Env): string {
  return (env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}`).replace(/\/$/, '');
}

/** Whether the development mailbox is served (the MAILBOX setting, else off only in production). */
export function mailboxEnabled(env: Env): boolean {
  return env.MAILBOX === undefined ? env.NODE_ENV !== 'production' : env.MAILBOX === 'on';
}
