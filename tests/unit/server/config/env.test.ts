import { describe, expect, it } from 'vitest';
import { developmentSessionSecret, loadEnv } from '@server/config/env.ts';

describe('loadEnv', () => {
  it('refuses to start in production on the built-in session secret, saying what to do', () => {
    expect(() => loadEnv({ NODE_ENV: 'production' })).toThrow(
      /Invalid environment:\n {2}SESSION_SECRET: production needs a secret of its own/,
    );
    expect(() =>
      loadEnv({ NODE_ENV: 'production', SESSION_SECRET: developmentSessionSecret }),
    ).toThrow(/SESSION_SECRET/);
  });

  it('starts in production with a secret of its own', () => {
    const env = loadEnv({ NODE_ENV: 'production', SESSION_SECRET: 'a'.repeat(64) });
    expect(env.SESSION_SECRET).toBe('a'.repeat(64));
  });

  it('keeps the built-in secret in development and tests', () => {
    expect(loadEnv({}).SESSION_SECRET).toBe(developmentSessionSecret);
    expect(loadEnv({ NODE_ENV: 'test' }).SESSION_SECRET).toBe(developmentSessionSecret);
  });

  it('lists every problem at once', () => {
    expect(() => loadEnv({ NODE_ENV: 'production', PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadEnv({ PORT: 'eighty', PGBOSS_SCHEMA: 'Bad-Schema' })).toThrow(
      /PORT: .*\n {2}PGBOSS_SCHEMA: /s,
    );
  });

  it("reads the worker's settings with their defaults", () => {
    const defaults = loadEnv({});
    expect(defaults).toMatchObject({
      PGBOSS_SCHEMA: 'pgboss',
      TRIAL_CALL_TIMEOUT_MS: 10_000,
      TRIAL_MEMORY_LIMIT_MB: 128,
      JOB_MAINTENANCE_SECONDS: 60,
      WORKER_SENDS_EMAIL: true,
      WORKER_STOP_GRACE_SECONDS: 30,
    });
    expect(defaults.TRIAL_TIMING_BUDGET_MS).toBeUndefined();
    const set = loadEnv({
      PGBOSS_SCHEMA: 'pgboss_other',
      TRIAL_CALL_TIMEOUT_MS: '300',
      TRIAL_TIMING_BUDGET_MS: '1500',
      WORKER_SENDS_EMAIL: 'false',
    });
    expect(set).toMatchObject({
      PGBOSS_SCHEMA: 'pgboss_other',
      TRIAL_CALL_TIMEOUT_MS: 300,
      TRIAL_TIMING_BUDGET_MS: 1500,
      WORKER_SENDS_EMAIL: false,
    });
    expect(() => loadEnv({ TRIAL_MEMORY_LIMIT_MB: '8' })).toThrow(/TRIAL_MEMORY_LIMIT_MB/);
  });
});
