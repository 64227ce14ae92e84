import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/errors.ts';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { startTestApp } from '@tests/helpers/test-app.ts';
import { createTestUser } from '@tests/helpers/users.ts';
import {
  CookieJar,
  signInAs,
  startSignInWorld,
  type SignInWorld,
} from '@tests/integration/server/auth/oauth-flow.ts';
import {
  call,
  startReviewWorld,
  type ReviewWorld,
} from '@tests/integration/server/candidates/review-world.ts';
import { seedCandidate } from '@tests/integration/server/candidates/seed-candidates.ts';
import { suiteTally } from '@tests/hardening/suite-tally.ts';

/** Authorization and transport cells: each test is one, and counts as held when it passes. */
const tally = suiteTally('security', 'held (no unexpected allow)');
afterAll(() => tally.print());

const databaseUrl = () => inject('databaseUrl');

async function expectError(res: Response, status: number, code: string): Promise<string> {
  expect(res.status).toBe(status);
  const body = apiErrorSchema.parse(await res.json());
  expect(body.error.code).toBe(code);
  return body.error.message;
}

describe('security headers', () => {
  it('sends a same-origin CSP that still allows the bundle, its workers and fonts', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl());
    try {
      const res = await fetch(`${app.url}/api/health`);
      const csp = res.headers.get('content-security-policy') ?? '';
      for (const directive of [
        "default-src 'self'",
        "script-src 'self'",
        "worker-src 'self' blob:",
        "font-src 'self' data:",
        "connect-src 'self'",
        "object-src 'none'",
        "frame-ancestors 'none'",
      ]) {
        expect(csp).toContain(directive);
      }
      // On plain http nothing may be upgraded or pinned to https.
      expect(csp).not.toContain('upgrade-insecure-requests');
      expect(res.headers.get('strict-transport-security')).toBeNull();
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('x-frame-options')).toBe('SAMEORIGIN');
      expect(res.headers.get('referrer-policy')).toBe('no-referrer');
      expect(res.headers.get('x-powered-by')).toBeNull();
    } finally {
      await app.close();
    }
    tally.held();
  });

  it('adds HSTS and upgrades insecure requests when the public address is https', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl());
    const https = await startTestApp(databaseUrl(), undefined, {
      PUBLIC_URL: 'https://stablehand.example.test',
    });
    try {
      const res = await fetch(`${https.url}/api/health`);
      expect(res.headers.get('strict-transport-security')).toMatch(/^max-age=\d+/);
      expect(res.headers.get('content-security-policy')).toContain('upgrade-insecure-requests');
    } finally {
      await https.close();
      await app.close();
    }
    tally.held();
  });
});

describe('rate limits', () => {
  it('turns away sign-in attempts over the limit with 429 in the error shape', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl(), undefined, { RATE_LIMIT_SIGN_IN: '2' });
    try {
      const start = () => fetch(`${app.url}/auth/github`, { redirect: 'manual' });
      expect((await start()).status).toBe(302);
      expect((await start()).status).toBe(302);
      const refused = await start();
      expect(refused.headers.get('ratelimit-policy')).toContain('q=2; w=60');
      expect(await expectError(refused, 429, 'rate-limited')).toBe(
        'Too many sign-in attempts: at most 2 in 60 seconds. Try again later.',
      );
    } finally {
      await app.close();
    }
    tally.held();
  });

  it('counts only refused API tokens, so a guesser is stopped and a valid token is not', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl(), undefined, { RATE_LIMIT_TOKEN_FAILURES: '2' });
    try {
      const user = await createTestUser(app.database.db);
      const me = (authorization: string) =>
        fetch(`${app.url}/api/me`, { headers: { authorization } });
      for (let i = 0; i < 5; i++) expect((await me(`Bearer ${user.token}`)).status).toBe(200);
      await expectError(await me('Bearer sh_guess_1'), 401, 'unauthenticated');
      await expectError(await me('Bearer sh_guess_2'), 401, 'unauthenticated');
      await expectError(await me('Bearer sh_guess_3'), 429, 'rate-limited');
      // The guesser's address is now refused even with a valid token, until the window ends.
      await expectError(await me(`Bearer ${user.token}`), 429, 'rate-limited');
    } finally {
      await app.close();
    }
    tally.held();
  });

  it('limits submissions per person, not per address', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl(), undefined, { RATE_LIMIT_SUBMISSIONS: '1' });
    try {
      const [first, second] = [
        await createTestUser(app.database.db),
        await createTestUser(app.database.db),
      ];
      const submit = (user: typeof first) =>
        fetch(`${app.url}/api/routines/987654321/candidates`, {
          method: 'POST',
          headers: user.headers,
          body: JSON.stringify({ title: 'Blocked LU', source: 'export {};' }),
        });
      // The first passes the limit and meets the routine check; the second is over the limit.
      expect((await submit(first)).status).toBe(404);
      await expectError(await submit(first), 429, 'rate-limited');
      expect((await submit(second)).status).toBe(404);
    } finally {
      await app.close();
    }
    tally.held();
  });

  it('leaves the limits on by default, high enough for normal use', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl());
    try {
      const res = await fetch(`${app.url}/auth/github`, { redirect: 'manual' });
      expect(res.headers.get('ratelimit-policy')).toContain('q=60; w=60');
    } finally {
      await app.close();
    }
    tally.held();
  });
});

describe('sessions and cookies', () => {
  let world: SignInWorld;
  beforeAll(async () => {
    world = await startSignInWorld(databaseUrl());
  });
  afterAll(() => world.close());

  it('sets the session cookie httpOnly and SameSite=Lax, not Secure on plain http', async () => {
    tally.tried();
    const res = await fetch(`${world.app.url}/auth/github`, { redirect: 'manual' });
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('stablehand.sid='));
    expect(cookie).toMatch(/; HttpOnly/i);
    expect(cookie).toMatch(/; SameSite=Lax/i);
    expect(cookie).not.toMatch(/; Secure/i);
    tally.held();
  });

  it('marks the cookie Secure when the public address is https (behind a loopback proxy)', async () => {
    tally.tried();
    const app = await startTestApp(databaseUrl(), undefined, {
      PUBLIC_URL: 'https://stablehand.example.test',
    });
    try {
      const res = await fetch(`${app.url}/auth/github`, {
        redirect: 'manual',
        headers: { 'x-forwarded-proto': 'https' },
      });
      const cookie = res.headers.getSetCookie().find((c) => c.startsWith('stablehand.sid='));
      expect(cookie).toMatch(/; Secure/i);
      expect(cookie).toMatch(/; HttpOnly/i);
    } finally {
      await app.close();
    }
    tally.held();
  });

  it('gives a new session id at sign-in; the id planted before it signs no one in', async () => {
    tally.tried();
    const trace = await signInAs(world, demoIdentities[1]!.login);
    const after = trace.jar.get('stablehand.sid');
    expect(trace.cookieBefore).not.toBe('');
    expect(after).toBeDefined();
    expect(after).not.toBe(trace.cookieBefore);
    const planted = new CookieJar();
    planted.set('stablehand.sid', trace.cookieBefore);
    const asPlanted = await fetch(`${world.app.url}/api/me`, {
      headers: { cookie: planted.header() },
    });
    await expectError(asPlanted, 401, 'unauthenticated');
    const asSignedIn = await fetch(`${world.app.url}/api/me`, {
      headers: { cookie: trace.jar.header() },
    });
    expect(asSignedIn.status).toBe(200);
    tally.held();
  });

  it('refuses a cross-origin form post that carries the session cookie', async () => {
    tally.tried();
    const { jar } = await signInAs(world, demoIdentities[2]!.login);
    const before = await fetch(`${world.app.url}/api/tokens`, {
      headers: { cookie: jar.header() },
    });
    const count = ((await before.json()) as unknown[]).length;
    const res = await fetch(`${world.app.url}/api/tokens`, {
      method: 'POST',
      headers: {
        cookie: jar.header(),
        origin: 'http://attacker.example',
        'content-type': 'application/x-www-form-urlencoded',
      },
      body: 'name=planted',
    });
    await expectError(res, 403, 'forbidden');
    const after = await fetch(`${world.app.url}/api/tokens`, { headers: { cookie: jar.header() } });
    expect(((await after.json()) as unknown[]).length).toBe(count);
    tally.held();
  });
});

describe('the review process against guessing and misuse', () => {
  let world: ReviewWorld;
  beforeAll(async () => {
    world = await startReviewWorld(databaseUrl());
  });
  afterAll(() => world.close());

  it('refuses a revoked token on every later request', async () => {
    tally.tried();
    const { author } = world.people;
    const created = await call(world.api('/tokens'), author, 'POST', { name: 'ci' });
    expect(created.status).toBe(201);
    const { token, id } = created.body as { token: string; id: number };
    const asToken = { ...author, headers: { ...author.headers, authorization: `Bearer ${token}` } };
    expect((await call(world.api('/me'), asToken)).status).toBe(200);
    expect((await call(world.api(`/tokens/${id}`), author, 'DELETE')).status).toBe(200);
    for (const path of ['/me', '/teams', `/routines/${world.routine.id}/candidates`]) {
      expect((await call(world.api(path), asToken)).status).toBe(401);
    }
    tally.held();
  });

  it("answers 404, not 403, to another team's guessed candidate, revision and trial ids", async () => {
    tally.tried();
    const seeded = await seedCandidate(
      world.db,
      world.routine,
      world.people.author.id,
      'in-review',
    );
    const { outsider } = world.people;
    for (const path of [
      `/candidates/${seeded.candidateId}`,
      `/revisions/${seeded.revisionId}`,
      `/trials/${seeded.trialId}`,
      `/candidates/${seeded.candidateId}/comments`,
      `/routines/${world.routine.id}/candidates`,
    ]) {
      const res = await call(world.api(path), outsider);
      expect([path, res.status]).toEqual([path, 404]);
    }
    const review = await call(
      world.api(`/candidates/${seeded.candidateId}/reviews`),
      outsider,
      'POST',
      {
        verdict: 'sign-off',
      },
    );
    expect(review.status).toBe(404);
    tally.held();
  });

  it("refuses the author's own sign-off through the API and records nothing", async () => {
    tally.tried();
    const { author } = world.people;
    const seeded = await seedCandidate(world.db, world.routine, author.id, 'in-review');
    const res = await call(world.api(`/candidates/${seeded.candidateId}/reviews`), author, 'POST', {
      verdict: 'sign-off',
    });
    expect(res.status).toBe(403);
    const detail = await call(world.api(`/candidates/${seeded.candidateId}`), author);
    expect(JSON.stringify(detail.body)).not.toContain('"verdict":"sign-off"');
    tally.held();
  });

  it('refuses to promote a candidate that is not cleared', async () => {
    tally.tried();
    const { author, maintainer } = world.people;
    const seeded = await seedCandidate(world.db, world.routine, author.id, 'in-review');
    const res = await call(
      world.api(`/candidates/${seeded.candidateId}/promote`),
      maintainer,
      'POST',
      {},
    );
    expect(res.status).toBe(409);
    const routine = await call(world.api(`/routines/${world.routine.id}`), maintainer);
    expect(JSON.stringify(routine.body)).not.toContain(
      `"incumbentRevisionId":${seeded.revisionId}`,
    );
    tally.held();
  });
});
