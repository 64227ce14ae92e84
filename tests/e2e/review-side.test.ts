import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { submissionSchema } from '@shared/api/candidates.ts';
import { routines } from '@server/db/schema/routines.ts';
import { safetyCaution } from '@shared/safety-caution.ts';

import { launchChromium, recordForeignRequests } from '@tests/helpers/browser.ts';
import { startTestApp } from '@tests/helpers/test-app.ts';
import {
  createRoutine,
  goodKernel,
  type RoutineRow,
} from '@tests/integration/server/candidates/review-world.ts';
import { seedPromotionHistory } from '@tests/integration/server/candidates/seed-candidates.ts';
import { finishTrial } from '@tests/integration/server/candidates/simulated-worker.ts';
import { seriousAxeViolations } from './axe-check.ts';
import { startReviewSideWorld, type ReviewSideWorld, type SignedIn } from './review-side-world.ts';

// The built client (npm test builds it before vitest runs); E2E_CLIENT_DIR points elsewhere.
const clientDir = process.env.E2E_CLIENT_DIR ?? path.resolve('dist/client');
const screenshots = path.resolve('.screenshots');

/** Revision 1 differs from the incumbent in two lines, so the diff has something to show. */
const revisionOne = goodKernel
  .replace('let p = k;', 'let p = k; // candidate pivot row')
  .replace('const pivot = a[k * n + k]!;', 'const pivot = a[k * n + k]!; // no scaling');
const revisionTwo = revisionOne.replace('// no scaling', '// pivot checked above');
const commentedLine =
  revisionOne.split('\n').findIndex((l) => l.includes('candidate pivot row')) + 1;

let world: ReviewSideWorld;
let browser: Browser;
let routine: RoutineRow;
let author: SignedIn;
let reviewer: SignedIn;
let maintainer: SignedIn;
let candidateId: number;
const pages: Record<string, Page> = {};
const foreignByPerson = new Map<string, string[]>();
const pageErrors: string[] = [];

/** A browser context of its own per person (separate cookies), with requests elsewhere recorded. */
async function personPage(who: SignedIn): Promise<Page> {
  const context: BrowserContext = await browser.newContext({
    viewport: { width: 1280, height: 900 },
    // The app's Content-Security-Policy forbids inline scripts; axe-core is injected as one.
    bypassCSP: true,
  });
  await world.enter(context, who);
  const page = await context.newPage();
  foreignByPerson.set(who.login, await recordForeignRequests(page, world.app.url));
  page.on('pageerror', (e) => pageErrors.push(`${who.login}: ${e.message}`));
  return page;
}

async function look(page: Page, name: string) {
  await page.screenshot({ path: path.join(screenshots, `b-${name}.png`), fullPage: true });
  expect(await seriousAxeViolations(page), `axe on ${name}`).toEqual([]);
}

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).textContent();
const candidateUrl = () => `${world.app.url}/teams/${world.team.slug}/candidates/${candidateId}`;

async function submitAndFinish(who: SignedIn, path: string, body: unknown) {
  const res = await world.send(who, 'POST', path, body);
  expect(res.status, `POST ${path}`).toBe(201);
  const submission = submissionSchema.parse(await res.json());
  expect(submission.trial).not.toBeNull();
  await finishTrial(world.app.database.db, world.env, submission.trial!.id);
  return submission;
}

beforeAll(async () => {
  mkdirSync(screenshots, { recursive: true });
  world = await startReviewSideWorld(inject('databaseUrl'), clientDir);
  const db = world.app.database.db;
  author = await world.signIn('ines.okafor', 'author');
  reviewer = await world.signIn('tomas.lindqvist', 'reviewer');
  maintainer = await world.signIn('priya.venkat', 'maintainer');
  routine = await createRoutine(db, world.team.id);
  await seedPromotionHistory(db, routine, maintainer.id, maintainer.id);
  const [row] = await db.select().from(routines).where(eq(routines.id, routine.id));
  routine = row!;
  const first = await submitAndFinish(author, `/routines/${routine.id}/candidates`, {
    title: 'LU with a marked pivot row',
    description: 'Same elimination; comments on the pivot search.',
    source: revisionOne,
  });
  candidateId = first.candidate.id;
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
  await world?.close();
});

describe('the review side of the web client in Chromium', { timeout: 90_000 }, () => {
  it('lets the reviewer comment on a line of the diff and send the candidate back with a reason', async () => {
    const page = await personPage(reviewer);
    pages.reviewer = page;
    await page.goto(candidateUrl(), { waitUntil: 'networkidle' });
    await expect.poll(() => heading(page)).toBe('LU with a marked pivot row');
    await expect.poll(() => page.locator('.monaco-diff-editor').count()).toBe(1);

    // A click on the line number in the candidate's gutter opens the comment form for that line.
    const lineNumber = page
      .locator('.editor.modified .line-numbers')
      .filter({ hasText: new RegExp(`^${commentedLine}$`) });
    await expect.poll(() => lineNumber.count()).toBe(1);
    await lineNumber.click();
    const box = page.getByLabel(`Comment on line ${commentedLine}`);
    await box.fill('Say why the first largest entry is the pivot for the frame matrices.');
    await page.getByRole('button', { name: 'Comment on line' }).click();
    const zone = page.locator('.line-comment-zone');
    await expect.poll(() => zone.textContent()).toContain('first largest entry');
    await expect
      .poll(() => page.getByRole('complementary').textContent())
      .toContain(`line ${commentedLine}`);

    // Sending back needs a reason: the shared schema's message shows and nothing is sent.
    await page.getByRole('button', { name: /Send back/ }).click();
    await expect.poll(() => page.getByText('say why the candidate is sent back').count()).toBe(1);
    await look(page, 'review-reviewer');

    await page.getByLabel(/Reason or remark/).fill('Add a test on a graded matrix first.');
    await page.getByRole('button', { name: /Send back/ }).click();
    await expect
      .poll(() => page.locator('[data-signal]').first().textContent())
      .toContain('returned');
    await expect
      .poll(() => page.getByTestId('no-verdict-reason').textContent())
      .toContain('in review');
    await expect
      .poll(() => page.getByRole('region', { name: 'Verdicts' }).textContent())
      .toContain('Add a test on a graded matrix first.');
  });

  it('shows the author what to fix and where to submit a new revision, without verdict buttons', async () => {
    const page = await personPage(author);
    pages.author = page;
    await page.goto(candidateUrl(), { waitUntil: 'networkidle' });
    const toFix = page.getByRole('region', { name: 'What to fix' });
    await expect.poll(() => toFix.textContent()).toContain('Add a test on a graded matrix first.');
    const revise = toFix.getByRole('link', { name: 'Submit a new revision' });
    expect(await revise.getAttribute('href')).toBe(
      `/teams/${world.team.slug}/candidates/${candidateId}/revise`,
    );
    expect(await page.getByTestId('no-verdict-reason').textContent()).toContain(
      'You wrote this candidate',
    );
    expect(await page.getByRole('button', { name: /Sign off/ }).count()).toBe(0);
    await look(page, 'review-author');
  });

  it('lets the reviewer sign off the new revision, which clears the candidate', async () => {
    await submitAndFinish(author, `/candidates/${candidateId}/revisions`, { source: revisionTwo });
    const page = pages.reviewer!;
    await page.goto(candidateUrl(), { waitUntil: 'networkidle' });
    await expect.poll(() => page.getByRole('button', { name: /Sign off/ }).count()).toBe(1);
    await page.getByRole('button', { name: /Sign off/ }).click();
    await expect
      .poll(() => page.locator('[data-signal]').first().textContent())
      .toContain('cleared');
    await expect
      .poll(() => page.getByTestId('no-verdict-reason').textContent())
      .toContain('You signed off revision 2');
  });

  it('lets the maintainer promote the cleared candidate through a confirmation showing the safety caution', async () => {
    const page = await personPage(maintainer);
    pages.maintainer = page;
    await page.goto(`${world.app.url}/teams/${world.team.slug}/routines/${routine.id}/promotions`, {
      waitUntil: 'networkidle',
    });
    await expect.poll(() => heading(page)).toBe('Promote or reinstate');
    const cleared = page.getByRole('region', { name: 'Cleared candidates' });
    await expect.poll(() => cleared.textContent()).toContain('LU with a marked pivot row');
    await look(page, 'promotions');

    await cleared.getByRole('button', { name: 'Promote…' }).click();
    const dialog = page.getByRole('dialog');
    await expect.poll(() => dialog.getByTestId('safety-caution').textContent()).toBe(safetyCaution);
    await dialog.getByLabel(/Note for the record/).fill('Reviewed against the frame set.');
    await look(page, 'promote-dialog');
    await dialog.getByRole('button', { name: 'Promote', exact: true }).click();

    const outcome = page.getByTestId('promotion-outcome');
    await expect.poll(() => outcome.textContent()).toContain('Promoted');
    expect(await outcome.textContent()).toContain('LU with a marked pivot row revision 2');
    expect(await outcome.textContent()).toContain('Reviewed against the frame set.');
    expect(await page.getByRole('dialog').count()).toBe(0);
    await expect.poll(() => cleared.textContent()).toContain('No candidate is cleared');
  });

  it('shows the new incumbent as the newest point of the logbook, linked to its trial', async () => {
    const page = pages.maintainer!;
    await page.goto(`${world.app.url}/teams/${world.team.slug}/routines/${routine.id}/logbook`, {
      waitUntil: 'networkidle',
    });
    await expect.poll(() => heading(page)).toBe('Logbook');
    const rows = page.getByTestId('logbook-points').locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(3);
    const newest = rows.first();
    expect(await newest.textContent()).toContain('promoted LU with a marked pivot row r2');
    // The promotion's snapshot: worst factor ratio 1.7 and the 64 × 64 median of 0.48 ms
    // (the invented results of tests/integration/server/candidates/simulated-worker.ts).
    expect(await newest.textContent()).toContain('1.7');
    expect(await newest.textContent()).toContain('0.48 ms');
    const trialLink = newest.getByRole('link');
    expect(await trialLink.getAttribute('href')).toMatch(
      new RegExp(`^/teams/${world.team.slug}/trials/\\d+$`),
    );
    await expect.poll(() => page.getByTestId('accuracy-chart').locator('svg a').count()).toBe(3);
    await look(page, 'logbook');
  });

  it('lets the maintainer invite, create a token shown once, and preview a Matrix Market file', async () => {
    const page = pages.maintainer!;
    await page.goto(`${world.app.url}/teams/${world.team.slug}/team`, { waitUntil: 'networkidle' });
    await expect.poll(() => heading(page)).toBe('Team');
    await expect.poll(() => page.getByTestId('members-table').locator('tbody tr').count()).toBe(3);

    await page.getByLabel('E-mail address').fill('mateo.achterberg@hallbrook-vey.example');
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect
      .poll(() => page.getByTestId('invitations-list').textContent())
      .toContain('mateo.achterberg@hallbrook-vey.example');

    await page.getByLabel('Token name').fill('nightly CI');
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = page.getByLabel('The new token');
    await expect.poll(() => secret.inputValue()).toMatch(/^shk_/);
    await expect.poll(() => page.getByTestId('tokens-table').textContent()).toContain('nightly CI');

    // A 3×3 symmetric stiffness block, lower triangle only (Matrix Market coordinate format).
    const mtx = [
      '%%MatrixMarket matrix coordinate real symmetric',
      '3 3 5',
      '1 1 4.0',
      '2 1 -1.0',
      '2 2 4.0',
      '3 2 -1.0',
      '3 3 4.0',
      '',
    ].join('\n');
    await page.getByLabel('Matrix Market file (.mtx)').setInputFiles({
      name: 'bay-block.mtx',
      mimeType: 'text/plain',
      buffer: Buffer.from(mtx),
    });
    const preview = page.getByTestId('upload-preview');
    await expect.poll(() => preview.textContent()).toContain('3 × 3');
    expect(await preview.textContent()).toContain('symmetric');
    await look(page, 'team-admin');
  });

  it('lists the e-mail the review sent in the development mailbox and opens one', async () => {
    expect(await world.deliverMail()).toBeGreaterThan(0);
    const page = pages.maintainer!;
    await page.goto(`${world.app.url}/dev/mailbox`, { waitUntil: 'networkidle' });
    await expect.poll(() => heading(page)).toBe('Development mailbox');
    const list = page.getByTestId('mailbox-list');
    await expect.poll(() => list.locator('tbody tr').count()).toBe(world.smtp.messages().length);
    expect(await list.textContent()).toContain('mateo.achterberg@hallbrook-vey.example');
    const newest = world.smtp.messages().at(-1)!;
    await list.getByRole('button', { name: newest.subject }).first().click();
    await expect
      .poll(() => page.getByTestId('mailbox-message').getByRole('heading').textContent())
      .toBe(newest.subject);
    // The HTML part is shown inside a sandboxed frame; its words must be there to read.
    await expect
      .poll(() =>
        page.frameLocator('[data-testid="mailbox-message"] iframe').locator('body').innerText(),
      )
      .toContain('Tragwerk Frame Analysis');
    await look(page, 'mailbox');
  });

  it('says plainly that a production server has no mailbox', async () => {
    const production = await startTestApp(world.databaseUrl, clientDir, {
      MAILBOX: 'off',
    });
    try {
      const page = await browser.newPage({ bypassCSP: true });
      await page.goto(`${production.url}/dev/mailbox`, { waitUntil: 'networkidle' });
      await expect
        .poll(() => page.getByTestId('mailbox-unavailable').textContent())
        .toContain('keeps no mailbox');
      expect(await page.getByTestId('mailbox-list').count()).toBe(0);
      await page.screenshot({ path: path.join(screenshots, 'b-mailbox-production.png') });
      expect(await seriousAxeViolations(page)).toEqual([]);
      await page.close();
    } finally {
      await production.close();
    }
  });

  it('sent nothing to another host and raised no page errors', () => {
    expect(foreignByPerson.size).toBe(3);
    expect([...foreignByPerson.values()].flat()).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
