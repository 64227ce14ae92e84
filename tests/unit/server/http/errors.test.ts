import type { AddressInfo } from 'node:net';
import express from 'express';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiErrorSchema } from '@shared/errors.ts';
import { AppError, errorHandler } from '@server/http/errors.ts';
import { requestLogger } from '@server/http/logger.ts';

// A small app that throws each kind of error the middleware must shape.
const app = express();
app.use(requestLogger(pino({ level: 'silent' })));
app.use(express.json({ limit: '1kb' }));
app.get('/app-error', () => {
  throw new AppError('forbidden', 'Only maintainers may promote.');
});
app.post('/zod', (req, res) => {
  const body = z.object({ n: z.number().int().positive() }).strict().parse(req.body);
  res.json(body);
});
app.get('/async-crash', async () => {
  await Promise.resolve();
  throw new Error('select * from secrets where password = $1');
});
app.use(errorHandler);

let base = '';
let server: ReturnType<typeof app.listen>;
beforeAll(async () => {
  server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

async function errorOf(res: Response) {
  return apiErrorSchema.parse(await res.json()).error;
}

describe('error middleware', () => {
  it('maps an AppError to its status and code', async () => {
    const res = await fetch(`${base}/app-error`);
    expect(res.status).toBe(403);
    expect(await errorOf(res)).toEqual({
      code: 'forbidden',
      message: 'Only maintainers may promote.',
    });
  });

  it('turns a zod failure into 400 validation-failed with field details', async () => {
    const res = await fetch(`${base}/zod`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ n: -2, extra: true }),
    });
    expect(res.status).toBe(400);
    const error = await errorOf(res);
    expect(error.code).toBe('validation-failed');
    const paths = (error.details as { path: string }[]).map((d) => d.path);
    expect(paths).toContain('n');
  });

  it('answers malformed JSON with 400 and an oversized body with 413', async () => {
    const bad = await fetch(`${base}/zod`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{"n": 1',
    });
    expect(bad.status).toBe(400);
    expect((await errorOf(bad)).code).toBe('validation-failed');
    const big = await fetch(`${base}/zod`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ n: 1, pad: 'x'.repeat(4096) }),
    });
    expect(big.status).toBe(413);
    expect((await errorOf(big)).code).toBe('payload-too-large');
  });

  it('hides the message of an unexpected async error behind 500 internal', async () => {
    const res = await fetch(`${base}/async-crash`);
    expect(res.status).toBe(500);
    const error = await errorOf(res);
    expect(error.code).toBe('internal');
    expect(error.message).not.toMatch(/secrets|select/);
    expect(res.headers.get('x-request-id')).toMatch(/^[\w-]+$/);
  });
});
