import AxeBuilder from '@axe-core/playwright';
import type { CellView, NotebookView, RunView } from '@cribra/contracts';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { guardLoopback } from './support/loopback-guard';
import { pageApi } from './support/page-api';
import { type Session, signedInSession } from './support/session';

/** axe-core's serious and critical findings on the page as it is now, as "rule: N node(s)" lines. */
async function seriousViolations(page: Page): Promise<string[]> {
  const { violations } = await new AxeBuilder({ page }).analyze();
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.length} node(s), e.g. ${v.nodes[0]?.target.join(' ')}`);
}

/** Buttons whose accessible name does not contain their visible label (e.g. a tooltip taking over the name). */
async function mislabelledButtons(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('button, a[role="button"], [role="button"]')]
      .map((b) => ({ text: (b as HTMLElement).innerText.trim(), label: b.getAttribute('aria-label') }))
      .filter((b) => b.text && b.label !== null && !b.label.toLowerCase().includes(b.text.toLowerCase()))
      .map((b) => `"${b.text}" is named "${b.label}"`),
  );
}

// Every page the suite reaches is checked with axe-core; no serious or critical violation may remain.
describe('accessibility of every page', () => {
  let browser: Browser;
  let s: Session;
  let notebookId = '';

  beforeAll(async () => {
    browser = await launchBrowser();
    s = await signedInSession(browser, demoUser((u) => u.email.startsWith('ilse.')));
    const nb = await pageApi<NotebookView>(s.page, 'POST', '/notebooks', { title: `Accessible ${Date.now()}`, summary: 'Checked by axe.' });
    notebookId = nb.id;
    const cell = await pageApi<CellView>(s.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'query', source: 'show 6 * 7 as "answer"' });
    await pageApi(s.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'note', source: 'A note with $p_n$.' });
    const run = await pageApi<RunView>(s.page, 'POST', `/cells/${cell.id}/runs`);
    for (let i = 0; i < 200; i++) {
      const r = await pageApi<RunView>(s.page, 'GET', `/runs/${run.id}`);
      if (!['queued', 'running'].includes(r.status)) break;
      await s.page.waitForTimeout(250);
    }
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('the sign-in page (signed out)', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    await guardLoopback(context);
    const page = await context.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await context.close();
  });

  const pages: Array<[string, string, (p: Page) => Promise<unknown>]> = [
    ['the notebook list', '/notebooks', (p) => p.getByRole('heading', { name: 'Notebooks' }).waitFor()],
    ['a notebook with outputs', '', (p) => p.getByTestId('value-output').first().waitFor()],
    ['the Data page', '/data', (p) => p.getByRole('heading', { name: 'Prime ledger' }).waitFor()],
    ['the account page', '/account', (p) => p.getByRole('heading').first().waitFor()],
  ];
  for (const [name, path, ready] of pages) {
    it(name, async () => {
      await s.page.goto(`${baseUrl()}${path || `/notebooks/${notebookId}`}`);
      await ready(s.page);
      await s.page.waitForTimeout(500);
      expect(await seriousViolations(s.page)).toEqual([]);
      expect(await mislabelledButtons(s.page)).toEqual([]);
    });
  }
});
