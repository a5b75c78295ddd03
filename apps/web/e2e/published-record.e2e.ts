import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl, repoRoot } from './support/env';
import { guardLoopback, type LoopbackGuard } from './support/loopback-guard';
import { saveScreenshot } from './support/screenshots';
import { signInThroughUi } from './support/sign-in-ui';

// The demo's locked notebook (seeds-demo/notebooks.json): its owner publishes the record, a reader
// who is not signed in opens /records/<id>, then the owner withdraws it and the reader sees the banner.
const TITLE = 'Gap patterns across wheel levels';
const CLI = join(repoRoot, 'apps', 'cli', 'dist', 'main.js');

describe('a published record', () => {
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const guards: LoopbackGuard[] = [];
  let owner: Page;
  let reader: Page;
  let recordPath = '';

  async function newPage(): Promise<Page> {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    contexts.push(context);
    guards.push(await guardLoopback(context));
    return context.newPage();
  }

  beforeAll(async () => {
    browser = await launchBrowser();
    owner = await newPage();
    reader = await newPage();
  });
  afterAll(async () => {
    for (const g of guards) g.assertLoopbackOnly();
    await browser?.close();
  });

  it('is published by the owner from the locked notebook', async () => {
    const teodor = demoUser((u) => u.email.startsWith('teodor.'));
    await owner.goto(`${baseUrl()}/notebooks`);
    await owner.waitForURL(/\/sign-in/);
    await signInThroughUi(owner, teodor);
    await owner.getByRole('link', { name: TITLE }).first().click();
    await owner.getByRole('heading', { name: TITLE }).waitFor();
    await owner.getByRole('tab', { name: 'Publish' }).click();
    await owner.getByRole('button', { name: 'Publish record' }).click();
    const link = owner.getByRole('region', { name: 'Publication' }).getByRole('link');
    await link.waitFor();
    recordPath = new URL(await link.innerText()).pathname;
    expect(recordPath).toMatch(/^\/records\/[0-9a-f]{20}$/);
  });

  it('is read signed out: verdicts, reviewers, citation, downloads and the verify command', async () => {
    await reader.goto(`${baseUrl()}${recordPath}`);
    await reader.getByRole('heading', { name: TITLE, level: 1 }).waitFor();
    expect(reader.url()).toMatch(new RegExp(`${recordPath}$`)); // not sent to sign-in
    const page = await reader.locator('main').innerText();
    expect(page).toContain('over p ∈ primes 3..23');
    expect(page).toContain('Noor Abeyratne');
    expect(await reader.getByRole('region', { name: 'Downloads' }).getByRole('link').count()).toBeGreaterThanOrEqual(4);
    expect(await reader.getByLabel('BibTeX entry').innerText()).toMatch(/^@misc\{cribra-[0-9a-f]{20},/);
    expect(await reader.getByLabel('Verify command').innerText()).toMatch(/^cribra verify http/);
    expect(await reader.getByTestId('withdrawn-banner').count()).toBe(0);
    const json = await reader.request.get(`${baseUrl()}/api${recordPath}/export?format=json`);
    expect(json.status()).toBe(200);
    expect((await json.json()).title).toBe(TITLE);
    // The reader checks the record offline with the command the page shows: every cell the same.
    const verify = spawnSync(process.execPath, [CLI, 'verify', `${baseUrl()}/api${recordPath}/export?format=json`, '--json', '--workers', '1'], { encoding: 'utf8', timeout: 300_000 });
    expect(verify.status, verify.stderr).toBe(0);
    const report = JSON.parse(verify.stdout) as { hashOk: boolean; counts: { same: number; differs: number; failed: number } };
    expect(report.hashOk).toBe(true);
    expect(report.counts).toMatchObject({ differs: 0, failed: 0 });
    expect(report.counts.same).toBeGreaterThanOrEqual(4); // two tables, the chart and two claims of the demo notebook
    await saveScreenshot(reader, 'published-record');
  });

  it('shows the withdrawn banner once its owner withdraws it, and stays readable', async () => {
    await owner.getByRole('button', { name: 'Withdraw…' }).click();
    await owner.getByLabel('Reason (shown on the record)').fill('Superseded by the level-29 census.');
    await owner.getByRole('button', { name: 'Withdraw record' }).click();
    await owner.getByText('Superseded by the level-29 census.').first().waitFor();
    await reader.reload();
    const banner = reader.getByTestId('withdrawn-banner');
    await banner.waitFor();
    expect(await banner.innerText()).toContain('Superseded by the level-29 census.');
    await reader.getByRole('heading', { name: TITLE, level: 1 }).waitFor();
    await saveScreenshot(reader, 'published-record-withdrawn');
  });
});
