import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { launchChromium, recordForeignRequests } from '@tests/helpers/browser.ts';
import { startTestApp, type RunningApp } from '@tests/helpers/test-app.ts';

// The built client (npm test builds it before vitest runs).
const clientDir = path.resolve('dist/client');

let app: RunningApp;
let browser: Browser;
beforeAll(async () => {
  app = await startTestApp(inject('databaseUrl'), clientDir);
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

describe('the served app in Chromium', () => {
  it('shows the product name in the shipped font, the database up, and loads nothing from elsewhere', async () => {
    const page = await browser.newPage();
    const foreign = await recordForeignRequests(page, app.url);
    const pageErrors: string[] = [];
    page.on('pageerror', (e) => pageErrors.push(e.message));

    await page.goto(app.url, { waitUntil: 'networkidle' });
    const name = page.getByTestId('product-name');
    await expect.poll(() => name.textContent()).toBe('Stablehand');

    const family = await name.evaluate((el) => getComputedStyle(el).fontFamily);
    expect(family.split(',')[0]?.trim()).toBe('"IBM Plex Sans"');
    // The face must really be loaded from our own assets, not merely named.
    await page.evaluate(() => document.fonts.ready);
    const loaded = await page.evaluate(() => ({
      sans: document.fonts.check('16px "IBM Plex Sans"'),
      mono: document.fonts.check('16px "IBM Plex Mono"'),
    }));
    expect(loaded.sans).toBe(true);

    await expect
      .poll(() => page.getByTestId('service-status').textContent())
      .toContain('database up');
    const health = (await page.evaluate(() => fetch('/api/health').then((r) => r.json()))) as {
      db: string;
    };
    expect(health.db).toBe('up');

    expect(foreign).toEqual([]);
    expect(pageErrors).toEqual([]);
    await page.close();
  });

  it('answers an unknown address with the 404 page, also on a direct load (history fallback)', async () => {
    const page = await browser.newPage();
    const res = await page.goto(`${app.url}/routines/does-not-exist`);
    expect(res?.status()).toBe(200);
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Nothing lives at this address');
    await page.getByRole('link', { name: 'Back to the start page' }).click();
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toContain('Review the numerical kernels');
    await page.close();
  });
});
