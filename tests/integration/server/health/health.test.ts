import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { healthSchema } from '@shared/api/health.ts';
import { apiErrorSchema } from '@shared/errors.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';
import pkg from '../../../../package.json' with { type: 'json' };

let app: RunningApp;
beforeAll(async () => {
  app = await startTestApp(inject('databaseUrl'));
});
afterAll(() => app.close());

describe('GET /api/health', () => {
  it('reports the database up and the package version', async () => {
    const res = await fetch(`${app.url}/api/health`);
    expect(res.status).toBe(200);
    const body = healthSchema.parse(await res.json());
    expect(body).toEqual({ ok: true, db: 'up', version: pkg.version });
  });

  it('reports the database down with 503 when it cannot be reached', async () => {
    // Port 1 on loopback refuses connections: a database that is not there.
    const down = await startTestApp('postgres://postgres@127.0.0.1:1/nothing');
    try {
      const res = await fetch(`${down.url}/api/health`);
      expect(res.status).toBe(503);
      expect(healthSchema.parse(await res.json())).toMatchObject({ ok: false, db: 'down' });
    } finally {
      await down.close();
    }
  });

  it('answers an unknown API route with the shared error shape', async () => {
    const res = await fetch(`${app.url}/api/no-such-thing`);
    expect(res.status).toBe(404);
    const body = apiErrorSchema.parse(await res.json());
    expect(body.error.code).toBe('not-found');
  });
});
