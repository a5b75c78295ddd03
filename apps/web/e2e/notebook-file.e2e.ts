// The `.sift` round trip in the browser: "Export .sift" on a demo notebook, then "New notebook from
// file" with the downloaded file gives a new draft with the same cells and titles.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { guardLoopback, type LoopbackGuard } from './support/loopback-guard';
import { signInThroughUi } from './support/sign-in-ui';

const TITLE = 'Gap patterns across wheel levels';

/** The cell cards' accessible names, in order ("Cell 1, note: Title"). */
async function cellLabels(page: Page): Promise<string[]> {
  await page.locator('section[data-cell-id]').first().waitFor();
  return page.locator('section[data-cell-id]').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
}

describe('notebook files in the browser', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let guard: LoopbackGuard;
  let importedId: string | null = null;

  beforeAll(async () => {
    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
    guard = await guardLoopback(context);
    page = await context.newPage();
  });

  afterAll(async () => {
    // Leave the demo as it was: the copy carries the demo notebook's title.
    if (importedId && page) {
      await page.evaluate(async (id) => {
        const { token } = await (await fetch('/api/auth/csrf')).json();
        await fetch(`/api/notebooks/${id}`, { method: 'DELETE', headers: { 'x-csrf-token': token } });
      }, importedId);
    }
    await browser?.close();
  });

  it('exports a notebook as .sift and makes a new notebook from the file', async () => {
    await page.goto(`${baseUrl()}/notebooks`);
    await page.waitForURL(/\/sign-in/);
    await signInThroughUi(page, demoUser((u) => u.email.startsWith('teodor.')));
    await page.getByRole('link', { name: TITLE }).click();
    await page.waitForURL(/\/notebooks\/[0-9a-f-]{36}$/);
    const originalUrl = page.url();
    const original = await cellLabels(page);
    expect(original.some((l) => /: .+/.test(l))).toBe(true);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export .sift' }).click()]);
    expect(download.suggestedFilename()).toMatch(/\.sift$/);
    const file = join(mkdtempSync(join(tmpdir(), 'cribra-e2e-sift-')), download.suggestedFilename());
    await download.saveAs(file);
    expect(readFileSync(file, 'utf8')).toContain(`@@@ title: ${TITLE}`);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Notebooks' }).click();
    await page.getByRole('button', { name: 'New notebook from file' }).waitFor();
    await page.getByLabel('Notebook file (.sift)').setInputFiles(file);
    await page.waitForURL((url) => /\/notebooks\/[0-9a-f-]{36}$/.test(url.pathname) && url.toString() !== originalUrl);
    importedId = page.url().split('/').pop()!;
    await page.getByRole('heading', { name: TITLE, level: 1 }).waitFor();
    expect(await cellLabels(page)).toEqual(original);
    expect(await page.getByText('Draft', { exact: true }).count()).toBeGreaterThan(0);
    guard.assertLoopbackOnly();
  });
});
