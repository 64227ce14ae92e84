import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  /** The address people use to reach the app; links in e-mail point here. */
  PUBLIC_URL: z.url().optional(),
  DATABASE_URL: z.url().default('postgres://postgres@127.0.0.1:54329/stablehand'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIR: z.string().optional(),
  SESSION_SECRET: z.string().min(16).default('development-only-session-secret'),
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
  MAIL_FROM: z.string().default('Stablehand <stablehand@localhost>'),
  /** Cron expression for drift checks of every incumbent (pg-boss schedule). */
  DRIFT_CHECK_CRON: z.string().default('0 3 * * *'),
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
