import type { CellView, NotebookView } from '@cribra/contracts';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { monacoText, pageApi } from './support/page-api';
import { saveScreenshot } from './support/screenshots';
import { type Session, signedInSession } from './support/session';

// Two members edit the same cell at once. The second save must meet the first as a conflict with
// both texts side by side — never be accepted over it (the lost update of issue 14).
describe('two people editing one cell', () => {
  let browser: Browser;
  let a: Session;
  let b: Session;
  let notebookId = '';
  let cellId = '';
  const ilse = demoUser((u) => u.email.startsWith('ilse.'));
  const teodor = demoUser((u) => u.email.startsWith('teodor.'));

  beforeAll(async () => {
    browser = await launchBrowser();
    a = await signedInSession(browser, ilse);
    b = await signedInSession(browser, teodor);
    const nb = await pageApi<NotebookView>(a.page, 'POST', '/notebooks', { title: `Shared cell ${Date.now()}` });
    notebookId = nb.id;
    await pageApi(a.page, 'POST', `/notebooks/${nb.id}/members`, { email: teodor.email, role: 'editor' });
    cellId = (await pageApi<CellView>(a.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'query', source: 'show 1' })).id;
  });
  afterAll(async () => {
    await browser?.close();
  });

  const cellOf = (s: Session) => s.page.locator(`section[data-cell-id="${cellId}"]`);

  it('keeps both edits: the stale save becomes a conflict with both texts, then a merge is saved', async () => {
    for (const s of [a, b]) {
      await s.page.goto(`${baseUrl()}/notebooks/${notebookId}`);
      await cellOf(s).locator('.monaco-editor').waitFor();
    }
    // B starts typing and does not save yet.
    await cellOf(b).locator('.monaco-editor').click();
    await b.page.keyboard.press('End');
    await b.page.keyboard.type(' + 2');

    // A edits the same cell and saves; B's page hears of the new revision and refetches.
    const bRefetched = b.page.waitForResponse((r) => r.url().endsWith(`/api/notebooks/${notebookId}`) && r.request().method() === 'GET');
    await cellOf(a).locator('.monaco-editor').click();
    await a.page.keyboard.press('End');
    await a.page.keyboard.type(' + 3');
    await a.page.keyboard.press('Control+s');
    await cellOf(a).getByTestId('cell-status').filter({ hasNotText: 'unsaved' }).waitFor();
    await bRefetched;
    await b.page.waitForTimeout(300);

    // B's unsaved text was not overwritten by the remote change, and B is told of it.
    expect(await monacoText(b.page, `section[data-cell-id="${cellId}"] .monaco-editor`)).toBe('show 1 + 2');
    const told = await cellOf(b).getByText(/saved revision \d+ while you were editing/).isVisible();

    // B saves: a conflict beside the cell, both texts in the diff editor, A's text still saved.
    await cellOf(b).locator('.monaco-editor').click();
    await b.page.keyboard.press('Control+s');
    await b.page.waitForTimeout(1000);
    // A's edit is still what is saved (on the code of issue 14 B's save replaced it here).
    expect((await pageApi<CellView>(a.page, 'GET', `/cells/${cellId}`)).source).toBe('show 1 + 3');
    const conflict = cellOf(b).getByRole('region', { name: 'Conflicting edits' });
    await conflict.waitFor();
    await conflict.locator('.monaco-diff-editor .editor.modified .view-line').first().waitFor();
    const sel = `section[data-cell-id="${cellId}"] section[aria-label="Conflicting edits"] .monaco-diff-editor`;
    expect(await monacoText(b.page, `${sel} .editor.original`)).toBe('show 1 + 3');
    expect(await monacoText(b.page, `${sel} .editor.modified`)).toBe('show 1 + 2');
    expect(told).toBe(true);
    await saveScreenshot(b.page, 'cell-conflict', { fullPage: false });

    // B edits the right-hand side into a merge of both and saves it over A's revision.
    await conflict.locator('.editor.modified .monaco-editor').click();
    await b.page.keyboard.press('Control+a');
    await b.page.keyboard.type('show 1 + 2 + 3');
    await conflict.getByRole('button', { name: 'Save merge' }).click();
    await conflict.waitFor({ state: 'detached' });
    const saved = await pageApi<CellView>(a.page, 'GET', `/cells/${cellId}`);
    expect(saved.source).toBe('show 1 + 2 + 3');
    expect(await monacoText(b.page, `section[data-cell-id="${cellId}"] .monaco-editor`)).toBe('show 1 + 2 + 3');

    // A had nothing unsaved, so A's page follows the merge.
    await expect
      .poll(() => monacoText(a.page, `section[data-cell-id="${cellId}"] .monaco-editor`), { timeout: 10_000 })
      .toBe('show 1 + 2 + 3');
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    a.guard.assertLoopbackOnly();
    b.guard.assertLoopbackOnly();
  });
});
