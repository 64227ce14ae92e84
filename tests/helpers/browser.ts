import { chromium, type Browser, type Page } from 'playwright-core';

/** Flags for Debian's Chromium on a machine with no outside network (see DEVELOPERS.md). */
export const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
}

/**
 * Records every request a page makes to a host other than the app's own, and aborts it,
 * so a test can assert that nothing leaves the machine.
 */
export async function recordForeignRequests(page: Page, appUrl: string): Promise<string[]> {
  const own = new URL(appUrl).host;
  const foreign: string[] = [];
  await page.route('**/*', (route) => {
    const url = new URL(route.request().url());
    if (url.protocol === 'data:' || url.host === own) return route.continue();
    foreign.push(url.toString());
    return route.abort();
  });
  return foreign;
}
