import type { LedgerBlockSummary, Page as ApiPage } from '@cribra/contracts';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { pageApi } from './support/page-api';
import { saveScreenshot } from './support/screenshots';
import { type Session, signedInSession } from './support/session';

// A long ledger request from the Data page: confirmed with its estimate, followed, cancelled.
describe('a ledger computation on the Data page', () => {
  let browser: Browser;
  let s: Session;
  const from = '90000000000';
  const to = '100000000000'; // the API's ranges are [from, to): 1 000 blocks of 10^7, about 83 s by the measured cost, so it asks first
  const toIncluded = '99999999999'; // the Data page's ranges include both ends, as everywhere

  beforeAll(async () => {
    browser = await launchBrowser();
    s = await signedInSession(browser, demoUser((u) => u.email.startsWith('teodor.')));
  });
  afterAll(async () => {
    await browser?.close();
  });

  const stored = async () => (await pageApi<ApiPage<LedgerBlockSummary>>(s.page, 'GET', `/ledger/blocks?from=${from}&to=${to}&pageSize=1`)).total;

  it('asks with the estimate, shows progress, and cancel stops the blocks while keeping the stored ones', async () => {
    const { page } = s;
    await page.goto(`${baseUrl()}/data`);
    await page.getByRole('heading', { name: 'Prime ledger' }).waitFor();
    await page.getByLabel('From').fill(from);
    await page.getByLabel('To', { exact: true }).fill(toIncluded);
    await page.getByRole('button', { name: 'Compute blocks' }).click();
    const dialog = page.getByRole('dialog', { name: 'Start a long computation?' });
    await dialog.waitFor();
    expect(await dialog.innerText()).toMatch(/about 1 min 23 s/);
    await dialog.getByRole('button', { name: 'Start it' }).click();

    const progress = page.getByRole('region', { name: /^Ledger computation/ });
    await progress.getByText(/Running: [1-9]\d* of 1000 blocks · elapsed .* left/).waitFor({ timeout: 60_000 });
    // The summary follows the stored blocks without a reload.
    await page.getByText(/\d+ blocks? stored/).waitFor();
    await saveScreenshot(page, 'data-ledger-progress');
    await progress.getByRole('button', { name: 'Cancel' }).click();
    await progress.getByText(/Cancelled: \d+ of 1000 blocks/).waitFor({ timeout: 10_000 });

    // A block under way may still land; after that the count stays, and what was stored is kept.
    await page.waitForTimeout(2_000);
    const kept = await stored();
    await page.waitForTimeout(3_000);
    expect(await stored()).toBe(kept);
    expect(kept).toBeGreaterThanOrEqual(1);
    expect(kept).toBeLessThan(1000);
    await saveScreenshot(page, 'data-ledger-cancelled');
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    s.guard.assertLoopbackOnly();
  });
});
