import path from 'node:path';
import { eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { users } from '@server/db/schema/users.ts';
import { matrixSetDetailSchema } from '@shared/api/matrix-sets.ts';
import { routineDetailSchema } from '@shared/api/routines.ts';
import { launchChromium, recordForeignRequests } from '@tests/helpers/browser.ts';
import { addMember, insertTeam, type TeamRef } from '@tests/helpers/team-fixture.ts';
import { createTestUser, type TestUser } from '@tests/helpers/users.ts';
import { seriousAxeViolations } from './axe-check.ts';
import { startClientWorld, type ClientWorld } from './client-world.ts';

// The built client (npm test builds it before vitest runs); E2E_CLIENT_DIR points elsewhere.
const clientDir = process.env.E2E_CLIENT_DIR ?? path.resolve('dist/client');
const screenshots = path.resolve('.screenshots');

let world: ClientWorld;
let browser: Browser;
let context: BrowserContext;
let page: Page;
let foreign: string[];
const pageErrors: string[] = [];
let team: TeamRef;
let maintainer: TestUser;
let routineId: number;

async function api(user: TestUser, apiPath: string, body: unknown): Promise<unknown> {
  const res = await fetch(`${world.app.url}/api${apiPath}`, {
    method: 'POST',
    headers: user.headers,
    body: JSON.stringify(body),
  });
  expect(res.status, `POST ${apiPath}`).toBe(201);
  return res.json();
}

async function expectAccessible(name: string) {
  await page.screenshot({ path: path.join(screenshots, `e2e-${name}.png`), fullPage: true });
  expect(await seriousAxeViolations(page), `axe on ${name}`).toEqual([]);
}

const heading = () => page.getByRole('heading', { level: 1 }).textContent();

beforeAll(async () => {
  world = await startClientWorld(inject('databaseUrl'), clientDir);
  const db = world.app.database.db;
  team = await insertTeam(db, 'Tragwerk Frame Analysis');
  maintainer = await createTestUser(db);
  await addMember(db, team.id, maintainer, 'maintainer');
  const set = matrixSetDetailSchema.parse(
    await api(maintainer, `/teams/${team.id}/matrix-sets`, {
      name: 'Frame quick set',
      timingSizes: [16],
      items: [
        { kind: 'generated', family: 'uniform', n: 8, seed: 1 },
        { kind: 'generated', family: 'hilbert', n: 6 },
        { kind: 'generated', family: 'uniform', n: 12, seed: 2 },
        { kind: 'generated', family: 'singular', n: 6 },
      ],
    }),
  );
  const routine = routineDetailSchema.parse(
    await api(maintainer, `/teams/${team.id}/routines`, {
      slug: 'dense-lu',
      title: 'Dense LU for frame stiffness',
      contract: 'lu-partial-pivoting',
      matrixSetId: set.id,
    }),
  );
  routineId = routine.id;

  browser = await launchChromium();
  context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  page = await context.newPage();
  foreign = await recordForeignRequests(page, world.app.url);
  page.on('pageerror', (e) => pageErrors.push(e.message));
});

afterAll(async () => {
  await browser?.close();
  await world?.close();
});

describe('part A of the web client in Chromium', () => {
  it(
    'signs in through the fake provider and lists my teams, then the routines of one',
    { timeout: 60_000 },
    async () => {
      await page.goto(world.app.url, { waitUntil: 'networkidle' });
      await expectAccessible('home-signed-out');
      // The fake provider shows its own page on its own port; that is the sign-in, not a leak.
      await page.unroute('**/*');
      await page.getByRole('main').getByRole('link', { name: 'Sign in with GitHub' }).click();
      await page.getByRole('button', { name: /priya\.venkat/ }).click();
      await page.waitForURL(`${world.app.url}/**`);
      foreign = await recordForeignRequests(page, world.app.url);

      // Signed in, but in no team yet.
      await expect.poll(heading).toBe('Welcome, Priya Venkat');
      await expect.poll(() => page.getByText('You are not in a team yet').count()).toBe(1);

      const db = world.app.database.db;
      const [priya] = await db.select().from(users).where(eq(users.login, 'priya.venkat'));
      await addMember(db, team.id, { id: priya!.id } as TestUser, 'author');
      await page.reload({ waitUntil: 'networkidle' });
      await page.getByRole('link', { name: /Tragwerk Frame Analysis/ }).click();
      await expect.poll(heading).toBe('Routines');
      expect(new URL(page.url()).pathname).toBe(`/teams/${team.slug}/routines`);
      await expect.poll(() => page.getByTestId('my-role').textContent()).toBe('author');
      await expect
        .poll(() => page.getByRole('link', { name: 'Dense LU for frame stiffness' }).count())
        .toBe(1);
      await expectAccessible('routines');

      await page.getByRole('link', { name: 'Dense LU for frame stiffness' }).click();
      await expect.poll(heading).toBe('Dense LU for frame stiffness');
      expect(new URL(page.url()).pathname).toBe(`/teams/${team.slug}/routines/${routineId}`);
      await expect.poll(() => page.getByText('No incumbent yet', { exact: false }).count()).toBe(1);
      await expect.poll(() => page.getByText('No candidates yet').count()).toBe(1);
      expect(await page.locator('pre').textContent()).toContain('export declare function factor');
      await expectAccessible('routine');
    },
  );

  it(
    'checks types as the author types, submits the starter kernel and follows the trial to its report',
    { timeout: 120_000 },
    async () => {
      await page.getByRole('link', { name: 'Submit a candidate' }).click();
      await expect.poll(heading).toBe('Submit a candidate');
      await page.waitForSelector('.monaco-editor', { timeout: 20_000 });
      const problems = page.getByTestId('editor-problems');
      await expect
        .poll(() => problems.textContent(), { timeout: 20_000 })
        .toContain('No type errors');
      await expectAccessible('submit');

      // A type error typed at the end of the kernel shows at once.
      await page.locator('.monaco-editor .view-lines').click();
      await page.keyboard.press('Control+End');
      await page.keyboard.insertText('\nexport const wrong: string = 42;\n');
      await expect
        .poll(() => problems.textContent(), { timeout: 20_000 })
        .toMatch(/\d+ type errors? against the contract/);
      expect(await problems.textContent()).toContain("not assignable to type 'string'");

      // The starter is a correct kernel; take it back and submit.
      await page.getByRole('button', { name: 'Start from the contract’s starter' }).click();
      await expect
        .poll(() => problems.textContent(), { timeout: 20_000 })
        .toContain('No type errors');

      // The form refuses an empty title with the shared schema's message.
      await page.getByRole('button', { name: 'Submit for trial' }).click();
      await expect.poll(() => page.getByText('give the candidate a title').count()).toBe(1);

      await page.getByLabel('Title').fill('Row-oriented GEPP from the starter');
      await page.getByRole('button', { name: 'Submit for trial' }).click();
      await expect
        .poll(() => page.getByTestId('type-check-result').textContent())
        .toContain('passed');
      await expect.poll(() => page.getByTestId('trial-progress').count()).toBe(1);

      // When the trial completes the page goes to its report.
      await page.waitForURL(/\/trials\/\d+$/, { timeout: 60_000 });
      await expect.poll(heading, { timeout: 20_000 }).toMatch(/^Trial #\d+/);
      await expect
        .poll(() => page.getByTestId('trial-verdict').textContent(), { timeout: 20_000 })
        .toMatch(/passes the policy|fails the policy/);
      expect(await page.getByTestId('verdict-rules').locator('li').count()).toBeGreaterThan(0);
      await expect
        .poll(() => page.getByTestId('matrix-count').textContent())
        .toBe('4 of 4 matrices');
      expect(await page.getByTestId('machine').textContent()).toContain('Cores');
      expect(await page.locator('figure svg, div[role="img"] svg').count()).toBeGreaterThan(0);
    },
  );

  it('sorts and filters the per-matrix table', { timeout: 60_000 }, async () => {
    const table = page.getByTestId('matrix-table');
    const firstMatrices = () =>
      table
        .locator('tbody tr')
        .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-matrix')));

    // Sorting by κ₁ puts the condition numbers in order, then the other way round.
    const kappaHeader = table.locator('thead th').filter({ hasText: 'κ₁' });
    await kappaHeader.getByRole('button').click();
    const sortedOnce = await kappaHeader.getAttribute('aria-sort');
    expect(['ascending', 'descending']).toContain(sortedOnce);
    const orderOnce = await firstMatrices();
    await kappaHeader.getByRole('button').click();
    expect(await kappaHeader.getAttribute('aria-sort')).not.toBe(sortedOnce);
    const orderTwice = await firstMatrices();
    expect(orderTwice).not.toEqual(orderOnce);

    await page.getByLabel('Family').selectOption('uniform');
    await expect.poll(() => page.getByTestId('matrix-count').textContent()).toBe('2 of 4 matrices');
    const families = await table
      .locator('tbody tr td:nth-child(2)')
      .evaluateAll((cells) => cells.map((c) => c.textContent));
    expect(families).toEqual(['uniform', 'uniform']);
    await page.getByLabel('Family').selectOption('');

    await page.getByLabel('Result').selectOption('failed');
    const failedShown = Number(
      (await page.getByTestId('matrix-count').textContent())!.split(' ')[0],
    );
    const failedListed = await page.getByTestId('failures').locator('> li').count();
    expect(failedShown).toBe(failedListed);
    await page.getByLabel('Result').selectOption('');
    await expect.poll(() => page.getByTestId('matrix-count').textContent()).toBe('4 of 4 matrices');
    await expectAccessible('trial-report');

    // The CSV export is the API's attachment, one line per matrix after the header.
    const csvHref = await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href');
    const csv = await page.evaluate((href) => fetch(href!).then((r) => r.text()), csvHref);
    expect(csv.trim().split('\r\n')).toHaveLength(5);
  });

  it(
    'submits a new revision whose signature breaks the contract: flagged as typed, then by the server',
    { timeout: 120_000 },
    async () => {
      const candidateHref = await page
        .getByRole('link', { name: 'Row-oriented GEPP from the starter' })
        .getAttribute('href');
      expect(candidateHref).toMatch(/\/candidates\/\d+$/);
      await page.goto(`${world.app.url}${candidateHref}/revise`, { waitUntil: 'networkidle' });
      await expect.poll(heading).toBe('New revision of “Row-oriented GEPP from the starter”');
      await page.waitForSelector('.monaco-editor', { timeout: 20_000 });
      const problems = page.getByTestId('editor-problems');
      // It starts from the latest revision's source, which checks.
      await expect
        .poll(() => problems.textContent(), { timeout: 20_000 })
        .toContain('No type errors');
      await expectAccessible('revise');

      await page.locator('.monaco-editor .view-lines').click();
      await page.keyboard.press('Control+A');
      await page.keyboard.insertText(
        'export function factor(a: Float64Array, n: number): string {\n  return `${a.length}x${n}`;\n}\n',
      );
      await expect
        .poll(() => problems.textContent(), { timeout: 45_000 })
        .toContain('`factor` does not match the contract');

      await page.getByRole('button', { name: 'Submit the revision for trial' }).click();
      const result = page.getByTestId('type-check-result');
      await expect.poll(() => result.textContent()).toMatch(/\d+ errors?/);
      expect(await result.textContent()).toContain('factor');
      expect(await page.getByTestId('trial-progress').count()).toBe(0);
    },
  );

  it('loaded nothing from another site and threw no page errors', () => {
    expect(foreign).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
