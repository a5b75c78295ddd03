import type { CellView, NotebookView, RunView, VerificationView } from '@cribra/contracts';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { pageApi } from './support/page-api';
import { saveScreenshot } from './support/screenshots';
import { type Session, signedInSession } from './support/session';

async function waitFinal<T extends { status: string }>(page: Page, path: string, final: (t: T) => boolean): Promise<T> {
  for (let i = 0; i < 240; i++) {
    const t = await pageApi<T>(page, 'GET', path);
    if (final(t)) return t;
    await page.waitForTimeout(250);
  }
  throw new Error(`${path} did not finish`);
}

// The owner and the reviewer have the notebook open side by side; neither reloads.
describe('review state reaches every open page', () => {
  let browser: Browser;
  let owner: Session;
  let reviewer: Session;
  let notebookId = '';
  const ilse = demoUser((u) => u.email.startsWith('ilse.'));
  const noor = demoUser((u) => u.email.startsWith('noor.'));

  beforeAll(async () => {
    browser = await launchBrowser();
    owner = await signedInSession(browser, ilse);
    reviewer = await signedInSession(browser, noor);
    const nb = await pageApi<NotebookView>(owner.page, 'POST', '/notebooks', { title: `Live review ${Date.now()}` });
    notebookId = nb.id;
    const cell = await pageApi<CellView>(owner.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'query', source: 'show 6 * 7' });
    const run = await pageApi<RunView>(owner.page, 'POST', `/cells/${cell.id}/runs`);
    await waitFinal<RunView>(owner.page, `/runs/${run.id}`, (r) => !['queued', 'running'].includes(r.status));
    await pageApi(owner.page, 'POST', `/notebooks/${nb.id}/members`, { email: noor.email, role: 'reviewer' });
    // The owner's own clean re-verify: it must not let the reviewer sign off.
    const v = await pageApi<VerificationView>(owner.page, 'POST', `/notebooks/${nb.id}/verifications`);
    await waitFinal<VerificationView>(owner.page, `/verifications/${v.id}`, (x) => x.status === 'done');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shows the review request on the reviewer page, and the sign-off enables the owner’s Lock button within 2 s', async () => {
    for (const s of [owner, reviewer]) {
      await s.page.goto(`${baseUrl()}/notebooks/${notebookId}`);
      await s.page.getByRole('heading', { name: 'Review', exact: true }).waitFor();
    }
    const lock = owner.page.getByRole('button', { name: 'Lock…' });
    expect(await lock.isDisabled()).toBe(true);

    await owner.page.getByRole('button', { name: 'Ask for review' }).click();
    // The reviewer's header and panel agree, without a reload.
    await reviewer.page.locator('header').getByText('In review', { exact: true }).waitFor({ timeout: 5_000 });
    await reviewer.page.getByText(/In review since/).waitFor({ timeout: 5_000 });

    // Someone else's clean re-verify does not offer a sign-off: the place says what to do first.
    const form = reviewer.page.getByRole('region', { name: 'Your review' });
    await form.waitFor();
    expect(await form.getByRole('button', { name: 'Sign off' }).count()).toBe(0);
    await form.getByRole('button', { name: 'Re-verify this revision yourself' }).click();
    await reviewer.page.getByText('Every cell gave the same outputs as recorded.').waitFor({ timeout: 120_000 });
    await form.getByLabel('Review comment').fill('Re-ran the cell myself: same digest.');
    const signOff = form.getByRole('button', { name: 'Sign off' });
    await signOff.waitFor();
    const signed = reviewer.page.waitForResponse((r) => r.url().endsWith(`/api/notebooks/${notebookId}/reviews`) && r.request().method() === 'POST');
    await signOff.click();
    expect((await signed).status()).toBe(201);
    const t0 = Date.now();
    await owner.page.waitForFunction(
      () => [...document.querySelectorAll('button')].some((b) => b.textContent === 'Lock…' && !b.disabled),
      undefined,
      { timeout: 2_000, polling: 50 },
    );
    const ms = Date.now() - t0;
    console.log(`owner's Lock button enabled ${ms} ms after the sign-off response`);
    expect(await owner.page.getByText(/Sign-offs on this revision:/).innerText()).toMatch(/1 of 1/);
    await saveScreenshot(owner.page, 'live-signoff-owner');
  });

  it('shows the lock on the reviewer page without a reload', async () => {
    await owner.page.getByRole('button', { name: 'Lock…' }).click();
    await owner.page.getByRole('dialog', { name: 'Lock this notebook' }).getByRole('button', { name: 'Lock notebook' }).click();
    await reviewer.page.getByText(/This notebook is locked/).waitFor({ timeout: 5_000 });
    expect(await reviewer.page.getByRole('button', { name: '+ Add query' }).count()).toBe(0);
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    owner.guard.assertLoopbackOnly();
    reviewer.guard.assertLoopbackOnly();
  });
});
