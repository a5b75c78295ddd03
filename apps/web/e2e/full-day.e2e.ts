import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { guardLoopback, type LoopbackGuard } from './support/loopback-guard';
import { waitForMailLink } from './support/mail';
import { typeInEditor } from './support/monaco';
import { saveScreenshot } from './support/screenshots';
import { signInThroughUi } from './support/sign-in-ui';

// A research day: an owner tests a conjecture, a reviewer re-verifies and signs off, the owner locks.
describe('a whole day in Cribra', () => {
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const guards: LoopbackGuard[] = [];
  let owner: Page;
  let reviewer: Page;
  let notebookUrl = '';
  const stamp = Date.now();
  const title = `Quintuplet pattern ${stamp}`;
  const reviewerEmail = `referee.${stamp}@northvale.example`;

  async function newPage(): Promise<Page> {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    contexts.push(context);
    guards.push(await guardLoopback(context));
    return context.newPage();
  }
  const cells = (page: Page) => page.locator('section[data-cell-id]');

  beforeAll(async () => {
    browser = await launchBrowser();
    owner = await newPage();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('signs in as the owner and creates a notebook', async () => {
    const user = demoUser((u) => u.siteRole === 'member');
    await owner.goto(`${baseUrl()}/`);
    await owner.waitForURL(/\/sign-in/);
    await signInThroughUi(owner, user);
    await owner.getByRole('heading', { name: 'Notebooks' }).waitFor();
    await saveScreenshot(owner, 'notebooks');
    await owner.getByRole('button', { name: 'New notebook', exact: true }).click();
    await owner.getByLabel('Title', { exact: true }).fill(title);
    await owner.getByLabel('Summary', { exact: true }).fill('Is {0, 2, 6, 8, 12} admissible, and how many gaps 6 does each wheel level hold?');
    await owner.getByLabel('Tags', { exact: true }).fill('quintuplets, wheel');
    await owner.getByRole('button', { name: 'Create notebook' }).click();
    await owner.getByRole('heading', { name: title }).waitFor();
    notebookUrl = owner.url();
    expect(notebookUrl).toMatch(/\/notebooks\/[0-9a-f-]{36}$/);
  });

  it('types an admissibility query in the editor, runs it and sees the verdict and the witness table', async () => {
    await owner.getByRole('button', { name: '+ Add query' }).click();
    const cell = cells(owner).nth(0);
    await typeInEditor(owner, cell, 'let H = {0, 2, 6, 8, 12}\nshow admissible(H) as "admissible"\nshow witness(H) as "witness"');
    await owner.keyboard.press('Control+Enter');
    const verdict = cell.getByTestId('value-output').first();
    await verdict.waitFor({ timeout: 60_000 });
    expect(await verdict.innerText()).toBe('true');
    const grid = cell.getByRole('grid');
    await grid.waitFor();
    expect(await grid.getByRole('columnheader', { name: 'prime' }).count()).toBe(1);
    // {0,2,6,8,12} misses residue 1 mod 2, 1 mod 3 and 4 mod 5 (least free classes, checked by hand).
    expect(await grid.getByRole('row').count()).toBe(4);
  });

  it('adds a claim over a range and a chart from the stored wheel levels', async () => {
    await owner.getByRole('button', { name: '+ Add claim' }).click();
    const claim = cells(owner).nth(1);
    await typeInEditor(owner, claim, 'claim sixes: gapcount(6, p) = 2·∏[q ∈ primes 5..p](q − 2) − 2·∏[q ∈ primes 5..p](q − 3)\n  over p ∈ primes 5..19');
    await owner.keyboard.press('Control+Enter');
    const card = claim.getByRole('region', { name: 'Claim holds' });
    await card.waitFor({ timeout: 60_000 });
    expect(await claim.getByTestId('verdict-range').innerText()).toBe('holds for every p ∈ primes 5..19 (6 cases, every case checked)');

    await owner.getByRole('button', { name: '+ Add query' }).click();
    const chart = cells(owner).nth(2);
    await typeInEditor(owner, chart, 'draw bar gaps(13): gap -> count as "Gaps of 13#"');
    await owner.keyboard.press('Control+Enter');
    await chart.getByRole('img', { name: 'Gaps of 13#' }).waitFor({ timeout: 60_000 });
    await chart.locator('.main-svg').first().waitFor();
    await saveScreenshot(owner, 'notebook');
  });

  it('invites a reviewer by e-mail and asks for review', async () => {
    await owner.getByRole('tab', { name: 'Members' }).click();
    await owner.getByLabel('Invite by e-mail').fill(reviewerEmail);
    await owner.getByRole('button', { name: 'Send invitation' }).click();
    await owner.getByText(`Invitation sent to ${reviewerEmail}.`).waitFor();
    await owner.getByRole('tab', { name: 'Review' }).click();
    await owner.getByRole('button', { name: 'Ask for review' }).click();
    await owner.getByText(/In review since/).waitFor();
  });

  it('lets the reviewer follow the mailed link, join, re-verify and sign off', async () => {
    const link = await waitForMailLink(reviewerEmail, /(https?:\/\/127\.0\.0\.1:\d+\/invitations\/[A-Za-z0-9_-]+)/);
    reviewer = await newPage();
    await reviewer.goto(link);
    await reviewer.getByRole('heading', { name: 'Invitation to a notebook' }).waitFor();
    await reviewer.getByLabel('Display name').waitFor();
    await saveScreenshot(reviewer, 'invitation');
    await reviewer.getByLabel('Display name').fill('Visiting Referee');
    await reviewer.getByLabel('Password', { exact: true }).fill('referee-password-1');
    await reviewer.getByRole('button', { name: 'Create account and join' }).click();
    await reviewer.getByRole('heading', { name: title }).waitFor();
    expect(reviewer.url()).toBe(notebookUrl);

    await reviewer.getByRole('button', { name: 'Re-verify' }).click();
    await reviewer.getByText('Every cell gave the same outputs as recorded.').waitFor({ timeout: 120_000 });
    await reviewer.getByLabel('Review comment').fill('Re-ran every cell: same digests. The claim is checked for p ≤ 19 only.');
    await reviewer.getByRole('button', { name: 'Sign off' }).click();
    await reviewer.getByText('You signed off this revision.').waitFor();
    await saveScreenshot(reviewer, 'review');
  });

  it('lets the owner lock the signed-off notebook, after which editing is refused', async () => {
    await owner.reload();
    await owner.getByRole('button', { name: 'Lock…' }).click();
    const dialog = owner.getByRole('dialog', { name: 'Lock this notebook' });
    await dialog.waitFor();
    expect(await dialog.innerText()).toMatch(/Computed evidence is not a proof/);
    expect(await dialog.innerText()).toContain('Visiting Referee');
    await saveScreenshot(owner, 'lock-dialog', { fullPage: false });
    await dialog.getByRole('button', { name: 'Lock notebook' }).click();
    await owner.getByText(/This notebook is locked/).waitFor();
    await owner.getByRole('region', { name: 'Lock record' }).waitFor();
    expect(await owner.getByRole('button', { name: '+ Add query' }).count()).toBe(0);
    expect(await owner.getByRole('button', { name: 'Run', exact: true }).count()).toBe(0);
    await saveScreenshot(owner, 'locked-notebook');

    // The server refuses an edit even when it is sent by hand.
    const status = await owner.evaluate(async (url) => {
      const id = url.split('/').pop()!;
      const nb = await (await fetch(`/api/notebooks/${id}`)).json();
      const { token } = await (await fetch('/api/auth/csrf')).json();
      const cell = nb.cells[0];
      const res = await fetch(`/api/cells/${cell.id}`, {
        method: 'PUT',
        headers: { 'content-type': 'application/json', 'x-csrf-token': token },
        body: JSON.stringify({ revision: cell.revision, source: 'show 1' }),
      });
      return res.status;
    }, notebookUrl);
    expect(status).toBe(409);
  });

  it('shows the stored data', async () => {
    await owner.getByRole('link', { name: 'Data' }).click();
    await owner.getByRole('heading', { name: 'Data' }).waitFor();
    await owner.getByRole('button', { name: 'Show level 13' }).click();
    const level = owner.getByRole('region', { name: 'Level 13' });
    await level.getByRole('img', { name: /Gaps between consecutive members of 13#/ }).waitFor();
    // φ(13#) = 5760 (OEIS A005867); the largest gap of the 13# wheel is 22 (OEIS A048670).
    expect(await level.innerText()).toMatch(/φ = 5\u2009760 · largest gap 22/);
    await saveScreenshot(owner, 'data');
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    for (const g of guards) {
      expect(g.requests.length).toBeGreaterThan(10);
      g.assertLoopbackOnly();
    }
  });
});
