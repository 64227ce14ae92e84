import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { apiErrorSchema } from '@shared/errors.ts';
import { maxUploadBytes } from '@shared/api/uploads.ts';
import { seedCandidate } from '@tests/integration/server/candidates/seed-candidates.ts';
import { createRoutine } from '@tests/integration/server/candidates/review-world.ts';
import { startTeamFixture, type ApiAnswer, type TeamFixture } from '@tests/helpers/team-fixture.ts';
import { suiteTally } from '@tests/hardening/suite-tally.ts';

const tally = suiteTally('bad input', 'rejected with nothing written');
let f: TeamFixture;
beforeAll(async () => {
  f = await startTeamFixture(inject('databaseUrl'));
});
afterAll(async () => {
  tally.print();
  await f.close();
});

/** Tables an accepted request could write to; a rejected one must leave every count alone. */
const tables = [
  'uploads',
  'audit_log',
  'candidates',
  'revisions',
  'trials',
  'comments',
  'reviews',
  'promotions',
  'matrix_sets',
  'routines',
  'teams',
  'memberships',
  'invitations',
  'api_tokens',
  'email_outbox',
];

async function rowCounts(): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of tables) {
    const result = await f.db.execute(sql.raw(`select count(*)::int as n from "${table}"`));
    counts[table] = (result.rows[0] as { n: number }).n;
  }
  return counts;
}

/** Sends a request, and expects a 4xx in the error shape with a message, and no row written. */
async function expectRejected(
  send: () => Promise<ApiAnswer>,
  expected: { status?: number; message?: RegExp } = {},
): Promise<string> {
  const before = await rowCounts();
  const res = await send();
  expect(res.status).toBeGreaterThanOrEqual(400);
  expect(res.status).toBeLessThan(500);
  if (expected.status) expect(res.status).toBe(expected.status);
  const { error } = apiErrorSchema.parse(res.body);
  expect(error.message.length).toBeGreaterThan(10);
  if (expected.message)
    expect(error.message + JSON.stringify(error.details ?? '')).toMatch(expected.message);
  expect(await rowCounts()).toEqual(before);
  return error.message;
}

const banner = '%%MatrixMarket matrix coordinate real general';
const symmetric = '%%MatrixMarket matrix coordinate real symmetric';
const lines = (...l: string[]) => `${l.join('\n')}\n`;

/** Malformed and hostile Matrix Market files, each with what its refusal must mention. */
const badFiles: { name: string; content: string | Uint8Array<ArrayBuffer>; message: RegExp }[] = [
  { name: 'an empty file', content: '', message: /empty|banner|header/i },
  { name: 'no banner', content: lines('3 3 1', '1 1 2'), message: /banner|MatrixMarket/i },
  {
    name: 'a misspelt banner',
    content: lines('%%MatrixMarkt matrix coordinate real general', '1 1 1', '1 1 2'),
    message: /banner|MatrixMarket/i,
  },
  {
    name: 'an unknown format',
    content: lines('%%MatrixMarket matrix diagonal real general', '1 1 1', '1 1 2'),
    message: /format|diagonal/i,
  },
  {
    name: 'an unknown field',
    content: lines('%%MatrixMarket matrix coordinate quaternion general', '1 1 1', '1 1 2'),
    message: /field|quaternion/i,
  },
  {
    name: 'complex values',
    content: lines('%%MatrixMarket matrix coordinate complex general', '1 1 1', '1 1 2 0'),
    message: /complex/i,
  },
  {
    name: 'an unknown symmetry',
    content: lines('%%MatrixMarket matrix coordinate real lopsided', '1 1 1', '1 1 2'),
    message: /symmetry|lopsided/i,
  },
  { name: 'no size line', content: lines(banner), message: /size/i },
  {
    name: 'a size line with words',
    content: lines(banner, 'three by three', '1 1 2'),
    message: /size|line 2/i,
  },
  { name: 'a negative size', content: lines(banner, '-3 3 1', '1 1 2'), message: /size|line 2/i },
  {
    name: 'fewer entries than declared',
    content: lines(banner, '3 3 4', '1 1 2', '2 2 2', '3 3 2'),
    message: /4|entr/i,
  },
  {
    name: 'more entries than declared',
    content: lines(banner, '2 2 1', '1 1 2', '2 2 2'),
    message: /entr|line 4/i,
  },
  {
    name: 'a row index out of range',
    content: lines(banner, '2 2 1', '3 1 2'),
    message: /range|line 3/i,
  },
  {
    name: 'a column index out of range',
    content: lines(banner, '2 2 1', '1 5 2'),
    message: /range|line 3/i,
  },
  {
    name: 'a zero index',
    content: lines(banner, '2 2 1', '0 1 2'),
    message: /range|line 3|1-based|zero/i,
  },
  {
    name: 'a non-numeric value',
    content: lines(banner, '2 2 1', '1 1 two'),
    message: /line 3|number/i,
  },
  {
    name: 'a fractional index',
    content: lines(banner, '2 2 1', '1.5 1 2'),
    message: /line 3|integer|index/i,
  },
  { name: 'NaN', content: lines(banner, '2 2 1', '1 1 NaN'), message: /line 3|finite|NaN|number/i },
  { name: 'Inf', content: lines(banner, '2 2 1', '1 1 Inf'), message: /line 3|finite|Inf|number/i },
  {
    name: 'a value that overflows to infinity',
    content: lines(banner, '2 2 1', '1 1 1e999'),
    message: /line 3|finite|number/i,
  },
  {
    name: 'a duplicated entry',
    content: lines(banner, '2 2 2', '1 1 2', '1 1 3'),
    message: /duplicate|line 4|twice/i,
  },
  {
    name: 'a symmetric file with an upper-triangle entry',
    content: lines(symmetric, '2 2 2', '1 1 2', '1 2 3'),
    message: /upper|triangle|line 4/i,
  },
  {
    name: 'a skew-symmetric file with a diagonal entry',
    content: lines('%%MatrixMarket matrix coordinate real skew-symmetric', '2 2 1', '1 1 3'),
    message: /diagonal|skew|line 3/i,
  },
  {
    name: 'a huge declared size with a tiny body',
    content: lines(banner, '1000000000 1000000000 1', '1 1 2'),
    message: /limit|large|4096|size/i,
  },
  {
    name: 'a dense array declaring 4096² entries with one value',
    content: lines('%%MatrixMarket matrix array real general', '4096 4096', '1'),
    message: /limit|large|size|entr/i,
  },
  {
    name: 'a zip-bomb-like declared entry count',
    content: lines(banner, '4 4 99999999999', '1 1 2'),
    message: /entr|limit|line 2|16/i,
  },
  {
    name: 'an extremely long line',
    content: lines(banner, '1 1 1', `1 1 ${'9'.repeat(5000)}`),
    message: /long|line 3|1024/i,
  },
  {
    name: 'UTF-16 text',
    content: new Uint8Array(Buffer.from(`\ufeff${lines(banner, '1 1 1', '1 1 2')}`, 'utf16le')),
    message: /UTF-8|encoding|text|banner/i,
  },
  {
    name: 'invalid UTF-8 bytes',
    content: new Uint8Array([...Buffer.from(`${banner}\n1 1 1\n1 1 `), 0xff, 0xfe, 0x0a]),
    message: /UTF-8|encoding|line 3|number/i,
  },
  {
    name: 'binary garbage',
    content: new Uint8Array(Array.from({ length: 512 }, (_, i) => (i * 37) % 256)),
    message: /UTF-8|banner|encoding|text/i,
  },
  {
    name: 'a NUL byte inside a line',
    content: lines(banner, '1 1 1', '1 1 2\u00003'),
    message: /line 3|number|character|NUL/i,
  },
];

describe('Matrix Market files through the upload route', () => {
  it('stores a good file and counts the rows it wrote (the control for the counts below)', async () => {
    const before = await rowCounts();
    const good = lines(symmetric, '2 2 2', '1 1 2', '2 1 -1');
    const res = await f.postFile(
      `/teams/${f.team.id}/uploads`,
      f.people.maintainer,
      good,
      'good.mtx',
    );
    expect(res.status).toBe(201);
    const after = await rowCounts();
    expect(after.uploads).toBe(before.uploads! + 1);
  });

  it.each(badFiles.map((c) => [c.name, c] as const))('refuses %s', async (_name, c) => {
    tally.tried();
    const { team, people } = f;
    await expectRejected(
      () => f.postFile(`/teams/${team.id}/uploads`, people.maintainer, c.content, 'bad.mtx'),
      {
        status: 400,
        message: c.message,
      },
    );
    tally.held();
  });

  it('refuses an upload over the size limit with 413', async () => {
    tally.tried();
    const big = new Uint8Array(maxUploadBytes + 1).fill(0x31);
    await expectRejected(
      () => f.postFile(`/teams/${f.team.id}/uploads`, f.people.maintainer, big),
      {
        status: 413,
        message: /at most \d+ bytes/,
      },
    );
    tally.held();
  });

  it('refuses two files, a wrong field name and a non-multipart body', async () => {
    tally.tried();
    const path = f.url(`/teams/${f.team.id}/uploads`);
    const headers = { authorization: `Bearer ${f.people.maintainer.token}` };
    const form = new FormData();
    form.append('matrix', new Blob(['x']), 'a.mtx');
    const send = async (body: FormData | string, extra: Record<string, string> = {}) => {
      const res = await fetch(path, { method: 'POST', body, headers: { ...headers, ...extra } });
      return { status: res.status, body: await res.json(), headers: res.headers };
    };
    await expectRejected(() => send(form), { status: 400 });
    const two = new FormData();
    two.append('file', new Blob(['x']), 'a.mtx');
    two.append('file', new Blob(['y']), 'b.mtx');
    await expectRejected(() => send(two), { status: 400 });
    await expectRejected(() => send('{"file":1}', { 'content-type': 'application/json' }), {
      status: 400,
    });
    tally.held();
  });
});

describe('bad JSON, wrong types, unknown fields and out-of-range values on every write route', () => {
  let ids: { routine: number; candidate: number; revision: number; set: number };
  beforeAll(async () => {
    const routine = await createRoutine(f.db, f.team.id);
    const seeded = await seedCandidate(f.db, routine, f.people.author.id, 'in-review');
    ids = {
      routine: routine.id,
      candidate: seeded.candidateId,
      revision: seeded.revisionId,
      set: routine.matrixSetId,
    };
  });

  /** Every JSON write route, as [method, path] with real ids of the fixture's team. */
  const routes = (): [string, string][] => [
    ['POST', '/teams'],
    ['POST', `/teams/${f.team.id}/routines`],
    ['PATCH', `/routines/${ids.routine}`],
    ['POST', `/teams/${f.team.id}/matrix-sets`],
    ['PUT', `/matrix-sets/${ids.set}`],
    ['POST', `/teams/${f.team.id}/invitations`],
    ['POST', '/invitations/accept'],
    ['PATCH', `/teams/${f.team.id}/members/${f.people.author.id}`],
    ['POST', `/routines/${ids.routine}/candidates`],
    ['POST', `/candidates/${ids.candidate}/revisions`],
    ['POST', `/candidates/${ids.candidate}/comments`],
    ['POST', `/candidates/${ids.candidate}/reviews`],
    ['POST', `/candidates/${ids.candidate}/promote`],
    ['POST', `/routines/${ids.routine}/reinstate`],
    ['POST', '/tokens'],
  ];

  /** Bodies no route accepts: each is wrong in a different way. */
  const badBodies: { name: string; raw: string }[] = [
    { name: 'JSON cut short', raw: '{"title": "Blocked LU", ' },
    { name: 'not JSON at all', raw: 'title=Blocked+LU' },
    { name: 'an array', raw: '[1, 2, 3]' },
    { name: 'a bare number', raw: '42' },
    {
      name: 'wrong types everywhere',
      raw: JSON.stringify({
        name: 7,
        title: [],
        slug: {},
        source: 5,
        verdict: 1,
        role: 2,
        email: false,
        revisionId: 'x',
        body: 9,
        line: 'x',
      }),
    },
    {
      name: 'only unknown fields',
      raw: JSON.stringify({
        isAdmin: true,
        __proto__: { polluted: 1 },
        constructor: { prototype: { polluted: 1 } },
      }),
    },
    {
      name: 'out-of-range numbers',
      raw: JSON.stringify({
        name: 'x'.repeat(5000),
        title: 'x'.repeat(5000),
        line: -1,
        revisionId: 1e308,
        signOffsRequired: -3,
        n: 1e9,
      }),
    },
  ];

  it.each(badBodies.map((b) => [b.name, b] as const))(
    'refuses %s on every route',
    async (_name, b) => {
      for (const [method, path] of routes()) {
        tally.tried();
        const user =
          path === '/teams' || path === '/tokens' || path === '/invitations/accept'
            ? f.people.author
            : f.people.maintainer;
        await expectRejected(async () => {
          const res = await fetch(f.url(path), {
            method,
            headers: { authorization: `Bearer ${user.token}`, 'content-type': 'application/json' },
            body: b.raw,
          });
          return { status: res.status, body: await res.json(), headers: res.headers };
        });
        tally.held();
      }
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    },
  );

  it('refuses ids that are not positive integers in every kind of path', async () => {
    for (const bad of ['0', '-1', 'abc', '1.5', '99999999999999999999', '1e3', '%00']) {
      for (const [method, path] of [
        ['GET', `/candidates/${bad}`],
        ['GET', `/trials/${bad}`],
        ['GET', `/revisions/${bad}`],
        ['POST', `/candidates/${bad}/withdraw`],
        ['GET', `/teams/${bad}/routines`],
      ] as const) {
        tally.tried();
        await expectRejected(() =>
          f.call(path, f.people.maintainer, method, method === 'POST' ? {} : undefined),
        );
        tally.held();
      }
    }
  });

  it('refuses a JSON body over the 1 MB limit with 413', async () => {
    tally.tried();
    const source = 'x'.repeat(1_100_000);
    await expectRejected(
      () =>
        f.call(`/routines/${ids.routine}/candidates`, f.people.author, 'POST', {
          title: 'Huge',
          source,
        }),
      {
        status: 413,
      },
    );
    tally.held();
  });

  it('refuses a kernel source over the engine limit without storing it', async () => {
    tally.tried();
    const source = `export {};\n// ${'x'.repeat(300_000)}\n`;
    await expectRejected(
      () =>
        f.call(`/routines/${ids.routine}/candidates`, f.people.author, 'POST', {
          title: 'Long',
          source,
        }),
      {
        message: /bytes|large|limit/i,
      },
    );
    tally.held();
  });
});
