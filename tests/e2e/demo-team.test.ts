import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { candidatePageSchema } from '@shared/api/candidates.ts';
import { logbookSchema, type Logbook } from '@shared/api/logbook.ts';
import { trialDetailSchema } from '@shared/api/trials.ts';
import { routinePageSchema, type RoutineSummary } from '@shared/api/routines.ts';
import { demoRoutines, type DemoRoutineKey } from '@server/demo/demo-routines.ts';
import { demoStory, type DemoEvent } from '@server/demo/demo-story.ts';
import { demoTeam } from '@server/demo/demo-team.ts';
import type { CookieJar } from '@tests/integration/server/auth/oauth-flow.ts';
import { launchChromium, recordForeignRequests } from '@tests/helpers/browser.ts';
import { seriousAxeViolations } from './axe-check.ts';
import { startDemoTeamWorld, type DemoTeamWorld } from './demo-team-world.ts';

// The built client (npm test builds it before vitest runs); E2E_CLIENT_DIR points elsewhere.
const clientDir = process.env.E2E_CLIENT_DIR ?? path.resolve('dist/client');
const screenshots = path.resolve('.screenshots');

type Submit = Extract<DemoEvent, { kind: 'submit' }>;
type Promote = Extract<DemoEvent, { kind: 'promote' }>;
type Reinstate = Extract<DemoEvent, { kind: 'reinstate' }>;

/** What the demo story says, read from its own definitions rather than copied here. */
const submits = new Map(
  demoStory.filter((e): e is Submit => e.kind === 'submit').map((e) => [e.candidate, e]),
);
const titleOf = (candidate: string) => submits.get(candidate)!.title;
const routineOf = (candidate: string) => submits.get(candidate)!.routine;
const promotes = demoStory.filter((e): e is Promote => e.kind === 'promote');
const reinstatement = demoStory.find((e): e is Reinstate => e.kind === 'reinstate')!;
const optimiserOffDrift = demoStory.find(
  (e) => e.kind === 'drift-check' && e.runtime === 'optimiser-off',
) as Extract<DemoEvent, { kind: 'drift-check' }>;

/** The incumbent each routine ends the story with: the last promotion or reinstatement. */
function finalIncumbents(): Map<DemoRoutineKey, string> {
  const incumbents = new Map<DemoRoutineKey, string>();
  for (const event of demoStory) {
    if (event.kind === 'promote') incumbents.set(routineOf(event.candidate), event.candidate);
    if (event.kind === 'reinstate') incumbents.set(event.routine, event.candidate);
  }
  return incumbents;
}

const routineDefinition = (key: DemoRoutineKey) => demoRoutines.find((r) => r.key === key)!;

let world: DemoTeamWorld;
let browser: Browser;
let maintainer: CookieJar;
let reviewer: CookieJar;
let routinesByKey: Map<DemoRoutineKey, RoutineSummary>;
const logbooks = new Map<DemoRoutineKey, Logbook>();
const foreign: string[] = [];
const pageErrors: string[] = [];

async function personPage(jar: CookieJar, width = 1280, height = 900): Promise<Page> {
  const context = await browser.newContext({
    viewport: { width, height },
    // The app's Content-Security-Policy forbids inline scripts; axe-core is injected as one.
    bypassCSP: true,
  });
  await world.enter(context, jar);
  const page = await context.newPage();
  const recorded = await recordForeignRequests(page, world.app.url);
  page.on('close', () => foreign.push(...recorded));
  page.on('pageerror', (e) => pageErrors.push(`${page.url()}: ${e.message}`));
  return page;
}

const teamUrl = (rest: string) => `${world.app.url}/teams/${world.teamSlug}${rest}`;
const trialHref = (trialId: number) => `/teams/${world.teamSlug}/trials/${trialId}`;
const heading = (page: Page) => page.getByRole('heading', { level: 1 }).textContent();
const navLink = (page: Page, name: string) =>
  page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name, exact: true });

/**
 * Every text element of the figure's chart (its widest SVG; legends hold small ones), and
 * whether its box reaches past the chart's left or right edge, where the SVG clips it.
 */
function figureTexts(host: Locator) {
  return host.evaluate((el) => {
    const [svg] = [...el.querySelectorAll('svg')].sort(
      (a, b) => b.getBoundingClientRect().width - a.getBoundingClientRect().width,
    );
    if (!svg) return [];
    const outer = svg.getBoundingClientRect();
    return [...svg.querySelectorAll('text')].map((t) => {
      const box = t.getBoundingClientRect();
      const outside = box.left < outer.left - 0.5 || box.right > outer.right + 0.5;
      return { text: t.textContent ?? '', outside };
    });
  });
}

async function open(page: Page, url: string, title: string) {
  await page.goto(url, { waitUntil: 'networkidle' });
  await expect.poll(() => heading(page), { timeout: 15_000 }).toBe(title);
}

beforeAll(async () => {
  mkdirSync(screenshots, { recursive: true });
  world = await startDemoTeamWorld(inject('databaseUrl'), clientDir);
  maintainer = await world.signIn(demoTeam.maintainer);
  reviewer = await world.signIn(demoTeam.members.find((m) => m.role === 'reviewer')!.login);
  const listed = routinePageSchema.parse(
    await world.read(maintainer, `/teams/${world.teamId}/routines`),
  );
  routinesByKey = new Map(
    demoRoutines.map((d) => [d.key, listed.items.find((r) => r.slug === d.slug)!]),
  );
  for (const [key, routine] of routinesByKey) {
    logbooks.set(
      key,
      logbookSchema.parse(await world.read(maintainer, `/routines/${routine.id}/logbook`)),
    );
  }
  browser = await launchChromium();
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await world?.close();
});

describe('the demo team in Chromium', { timeout: 60_000 }, () => {
  it('names every routine and its incumbent on the routines list, with Routines as the current section', async () => {
    expect(routinesByKey.size).toBe(demoRoutines.length);
    const page = await personPage(maintainer);
    await open(page, teamUrl('/routines'), 'Routines');
    const incumbents = finalIncumbents();
    for (const definition of demoRoutines) {
      const row = page
        .getByRole('row')
        .filter({ has: page.getByRole('link', { name: definition.title, exact: true }) });
      await expect.poll(() => row.count()).toBe(1);
      const incumbent = titleOf(incumbents.get(definition.key)!);
      expect(await row.getByRole('link', { name: incumbent, exact: true }).count()).toBe(1);
    }
    expect(await navLink(page, 'Routines').getAttribute('aria-current')).toBe('page');
    expect(await navLink(page, 'Logbook').getAttribute('aria-current')).toBeNull();
    await page.screenshot({ path: path.join(screenshots, 'demo-routines.png'), fullPage: true });

    await navLink(page, 'Logbook').click();
    await expect.poll(() => heading(page)).toBe('Logbook');
    expect(await navLink(page, 'Logbook').getAttribute('aria-current')).toBe('page');
    expect(await navLink(page, 'Routines').getAttribute('aria-current')).toBeNull();

    // A routine's own logbook sits under /routines/ in the address but belongs to the logbooks.
    await page.getByRole('link', { name: routineDefinition('lu').title, exact: true }).click();
    await expect.poll(() => page.url()).toMatch(/\/routines\/\d+\/logbook$/);
    await expect.poll(() => heading(page)).toBe('Logbook');
    expect(await navLink(page, 'Logbook').getAttribute('aria-current')).toBe('page');
    expect(await navLink(page, 'Routines').getAttribute('aria-current')).toBeNull();
    await page.close();
  });

  it("shows the drift alert and both promotions in the frame LU's logbook, each linked to its trial", async () => {
    const key = optimiserOffDrift.routine;
    const logbook = logbooks.get(key)!;
    const page = await personPage(maintainer);
    await open(page, teamUrl(`/routines/${routinesByKey.get(key)!.id}/logbook`), 'Logbook');
    const rows = page.getByTestId('logbook-points').locator('tbody tr');
    // One row per promotion and per drift check of the story (their trials load one by one).
    const driftChecks = demoStory.filter((e) => e.kind === 'drift-check' && e.routine === key);
    const promoted = promotes.filter((p) => routineOf(p.candidate) === key);
    await expect
      .poll(() => rows.count(), { timeout: 15_000 })
      .toBe(promoted.length + driftChecks.length);

    for (const [i, event] of promoted.entries()) {
      const row = rows.filter({ hasText: `promoted ${titleOf(event.candidate)} r1` });
      expect(await row.count(), titleOf(event.candidate)).toBe(1);
      const record = logbook.promotions[i]!;
      expect(record.candidateTitle).toBe(titleOf(event.candidate));
      expect(await row.getByRole('link').getAttribute('href')).toBe(trialHref(record.trialId));
    }

    // The re-run with the optimiser off came out slower: drifted, with its alert open.
    const check = logbook.driftChecks.at(-1)!;
    expect(check).toMatchObject({ status: 'drifted', alertOpen: true });
    const driftRow = rows.filter({ hasText: 'drift check: drifted' });
    expect(await driftRow.count()).toBe(1);
    expect(await driftRow.getByRole('link').getAttribute('href')).toBe(trialHref(check.trialId!));
    const alert = page.getByRole('alert').filter({ hasText: 'open drift alert' });
    expect(await alert.textContent()).toContain('1 open drift alert');
    const checks = page.getByRole('region', { name: 'Drift checks' });
    expect(await checks.textContent()).toContain('alert open');
    const checkLink = checks.getByRole('link', { name: `trial #${check.trialId}` });
    expect(await checkLink.getAttribute('href')).toBe(trialHref(check.trialId!));
    for (const chart of ['accuracy-chart', 'timing-chart']) {
      const texts = await figureTexts(page.getByTestId(chart));
      expect(texts.length, chart).toBeGreaterThan(0);
      expect(
        texts.filter((t) => t.outside).map((t) => t.text),
        chart,
      ).toEqual([]);
    }
    await page.screenshot({ path: path.join(screenshots, 'demo-logbook-lu.png'), fullPage: true });
    await page.close();
  });

  it("shows the reinstatement as a reinstatement in the triangular solve's logbook, linked to its trial", async () => {
    const key = reinstatement.routine;
    const logbook = logbooks.get(key)!;
    const record = logbook.promotions.find((p) => p.kind === 'reinstate')!;
    expect(record.candidateTitle).toBe(titleOf(reinstatement.candidate));
    const page = await personPage(maintainer);
    await open(page, teamUrl(`/routines/${routinesByKey.get(key)!.id}/logbook`), 'Logbook');
    const rows = page.getByTestId('logbook-points').locator('tbody tr');
    const label = `reinstated ${titleOf(reinstatement.candidate)} r${record.revisionNumber}`;
    // The newest point comes first: the reinstatement is the last event of this routine's story.
    await expect.poll(() => rows.first().textContent(), { timeout: 15_000 }).toContain(label);
    expect(await rows.first().getByRole('link').getAttribute('href')).toBe(
      trialHref(record.trialId),
    );
    // The first promotion and the reinstatement of the same kernel are two points, not one.
    expect(
      await rows.filter({ hasText: `promoted ${titleOf(reinstatement.candidate)}` }).count(),
    ).toBe(1);
    const tenures = page.getByRole('region', { name: 'Tenures' }).getByRole('listitem');
    expect(await tenures.count()).toBe(logbook.promotions.length);
    expect(await tenures.first().textContent()).toContain(titleOf(reinstatement.candidate));
    expect(await tenures.first().textContent()).toContain('incumbent now');
    await page.screenshot({ path: path.join(screenshots, 'demo-logbook-bs.png'), fullPage: true });
    await page.close();
  });

  it('lists the reinstatement, with its note and trial, on the promotions page of that routine', async () => {
    const key = reinstatement.routine;
    const record = logbooks.get(key)!.promotions.find((p) => p.kind === 'reinstate')!;
    const page = await personPage(maintainer);
    await open(
      page,
      teamUrl(`/routines/${routinesByKey.get(key)!.id}/promotions`),
      'Promote or reinstate',
    );
    const entries = page.getByRole('region', { name: 'Promotion record' }).getByRole('listitem');
    await expect.poll(() => entries.count()).toBe(logbooks.get(key)!.promotions.length);
    const newest = entries.first();
    expect(await newest.textContent()).toContain(
      `Reinstated ${titleOf(reinstatement.candidate)} revision ${record.revisionNumber}`,
    );
    expect(await newest.textContent()).toContain(reinstatement.note);
    expect(
      await newest.getByRole('link', { name: `trial #${record.trialId}` }).getAttribute('href'),
    ).toBe(trialHref(record.trialId));
    await page.close();
  });

  it('keeps every label of the timing plot inside the figure on a trial timed against an incumbent', async () => {
    // The second promotion of the frame LU was timed against the first incumbent.
    const record = logbooks.get('lu')!.promotions[1]!;
    // The measured ratios and intervals, to read beside a failure (they differ from run to run).
    const trial = trialDetailSchema.parse(
      await world.read(maintainer, `/trials/${record.trialId}`),
    );
    const measured = JSON.stringify(trial.timing.map((t) => [t.n, t.ratio, t.ci95, t.verdict]));
    for (const width of [1280, 1024]) {
      const page = await personPage(maintainer, width, 800);
      await page.goto(`${world.app.url}${trialHref(record.trialId)}`, {
        waitUntil: 'networkidle',
      });
      const figure = page.getByRole('region', { name: 'Timing against the incumbent' });
      await expect.poll(() => figure.locator('svg').count(), { timeout: 15_000 }).toBe(1);
      const texts = await figureTexts(figure);
      const ratioLabels = texts.filter((t) =>
        /× (faster|slower|no clear difference)$/.test(t.text),
      );
      expect(ratioLabels.length, `ratio labels at ${width} px`).toBe(
        routineDefinition('lu').set.timingSizes.length,
      );
      // Every tick of the ratio axis carries its label, not 1× alone.
      const tickLabels = texts.filter((t) => /^\d+(\.\d+)?×$/.test(t.text));
      const all = `${texts.map((t) => t.text).join(' | ')} — measured ${measured}`;
      expect(
        tickLabels.map((t) => t.text),
        all,
      ).toContain('1×');
      expect(tickLabels.length, `tick labels at ${width} px: ${all}`).toBeGreaterThanOrEqual(3);
      expect(
        texts.filter((t) => t.outside).map((t) => t.text),
        `at ${width} px`,
      ).toEqual([]);
      // The timing table names the blocks the rounds ran in, as the report records them.
      const blocks = trial.timing.find((t) => t.blocks)?.blocks;
      expect(blocks, `blocks in the stored report: ${measured}`).toBeGreaterThan(0);
      expect(await page.getByTestId('timing-table').textContent()).toContain(`in ${blocks} blocks`);
      await page.screenshot({
        path: path.join(screenshots, `demo-trial-${width}.png`),
        fullPage: true,
      });
      await page.close();
    }
  });

  it(
    'fits the part B pages into 1024 px without sideways scrolling or serious axe findings',
    { timeout: 90_000 },
    async () => {
      let inReview: { id: number; title: string } | undefined;
      for (const routine of routinesByKey.values()) {
        const listed = candidatePageSchema.parse(
          await world.read(reviewer, `/routines/${routine.id}/candidates?state=in-review`),
        );
        inReview ??= listed.items[0];
      }
      expect(inReview, 'a candidate in review').toBeDefined();
      const lu = routinesByKey.get('lu')!.id;
      const bs = routinesByKey.get(reinstatement.routine)!.id;
      const stops: { name: string; who: CookieJar; url: string; title: string }[] = [
        { name: 'routines', who: maintainer, url: teamUrl('/routines'), title: 'Routines' },
        {
          name: 'routine',
          who: maintainer,
          url: teamUrl(`/routines/${lu}`),
          title: routineDefinition('lu').title,
        },
        {
          name: 'review',
          who: reviewer,
          url: teamUrl(`/candidates/${inReview!.id}`),
          title: inReview!.title,
        },
        {
          name: 'promotions',
          who: maintainer,
          url: teamUrl(`/routines/${bs}/promotions`),
          title: 'Promote or reinstate',
        },
        { name: 'logbook', who: maintainer, url: teamUrl('/logbook'), title: 'Logbook' },
        { name: 'team-admin', who: maintainer, url: teamUrl('/team'), title: 'Team' },
        {
          name: 'mailbox',
          who: maintainer,
          url: `${world.app.url}/dev/mailbox`,
          title: 'Development mailbox',
        },
      ];
      const pages = new Map<CookieJar, Page>();
      for (const stop of stops) {
        let page = pages.get(stop.who);
        if (!page) {
          page = await personPage(stop.who, 1024, 800);
          pages.set(stop.who, page);
        }
        await open(page, stop.url, stop.title);
        if (stop.name === 'review') {
          await expect.poll(() => page.locator('.monaco-diff-editor').count()).toBe(1);
        }
        if (stop.name === 'mailbox') {
          // The story's e-mail, a page of at most 50 at a time (mailbox.queries.ts), with the count.
          const total = world.smtp.messages().length;
          await expect
            .poll(() => page.getByTestId('mailbox-list').locator('tbody tr').count())
            .toBe(Math.min(total, 50));
          expect(await page.getByRole('main').textContent()).toContain(`of ${total}`);
        }
        await page.screenshot({
          path: path.join(screenshots, `demo-1024-${stop.name}.png`),
          fullPage: true,
        });
        const widths = await page.evaluate(() => ({
          scroll: document.documentElement.scrollWidth,
          inner: window.innerWidth,
        }));
        expect(widths.scroll, `${stop.name}: document width`).toBeLessThanOrEqual(widths.inner);
        expect(await seriousAxeViolations(page), `axe on ${stop.name}`).toEqual([]);
      }
      for (const page of pages.values()) await page.close();
    },
  );

  it('sent nothing to another host and raised no page errors', () => {
    expect(foreign).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
