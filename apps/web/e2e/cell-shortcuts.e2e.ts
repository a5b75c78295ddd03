import type { CellView, NotebookView } from '@cribra/contracts';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { pageApi } from './support/page-api';
import { saveScreenshot } from './support/screenshots';
import { type Session, signedInSession } from './support/session';

// Keyboard shortcuts act on the cell whose editor has the focus, not on the last editor created.
describe('shortcuts in a six-cell notebook', () => {
  let browser: Browser;
  let owner: Session;
  let viewer: Session;
  let notebookId = '';
  let cells: CellView[] = [];
  const ilse = demoUser((u) => u.email.startsWith('ilse.'));
  const noor = demoUser((u) => u.email.startsWith('noor.'));

  beforeAll(async () => {
    browser = await launchBrowser();
    owner = await signedInSession(browser, ilse);
    const nb = await pageApi<NotebookView>(owner.page, 'POST', '/notebooks', { title: `Six cells ${Date.now()}` });
    notebookId = nb.id;
    for (let i = 1; i <= 6; i++) cells.push(await pageApi<CellView>(owner.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'query', source: `show ${i}` }));
    await pageApi(owner.page, 'POST', `/notebooks/${nb.id}/members`, { email: noor.email, role: 'viewer' });
  });
  afterAll(async () => {
    await browser?.close();
  });

  const card = (i: number) => owner.page.locator(`section[data-cell-id="${cells[i].id}"]`);

  it('Ctrl+Enter in cell 1 runs cell 1; Ctrl+S in cell 3 saves cell 3', async () => {
    await owner.page.goto(`${baseUrl()}/notebooks/${notebookId}`);
    for (let i = 0; i < 6; i++) await card(i).locator('.monaco-editor').waitFor();

    await card(0).locator('.monaco-editor').click();
    await owner.page.keyboard.press('Control+Enter');
    const value = card(0).getByTestId('value-output').first();
    await value.waitFor({ timeout: 60_000 });
    expect(await value.innerText()).toBe('1');
    const runs = await pageApi<{ items: unknown[] }>(owner.page, 'GET', `/notebooks/${notebookId}/runs`);
    expect(runs.items).toHaveLength(1);
    expect(await card(5).getByTestId('cell-status').innerText()).toContain('not run yet');

    await card(2).locator('.monaco-editor').click();
    await owner.page.keyboard.press('End');
    await owner.page.keyboard.type(' + 30');
    await owner.page.keyboard.press('Control+s');
    await card(2).getByTestId('cell-status').filter({ hasNotText: 'unsaved' }).waitFor();
    expect((await pageApi<CellView>(owner.page, 'GET', `/cells/${cells[2].id}`)).source).toBe('show 3 + 30');
    expect((await pageApi<CellView>(owner.page, 'GET', `/cells/${cells[5].id}`)).source).toBe('show 6');
    expect(await owner.page.getByTestId('shortcut-hint').innerText()).toMatch(/Ctrl\s*\+\s*Enter saves and runs it/);
    await saveScreenshot(owner.page, 'shortcuts');
  });

  it('hides the shortcut hint where the notebook is read-only', async () => {
    viewer = await signedInSession(browser, noor);
    await viewer.page.goto(`${baseUrl()}/notebooks/${notebookId}`);
    await viewer.page.locator(`section[data-cell-id="${cells[0].id}"]`).waitFor();
    expect(await viewer.page.getByTestId('shortcut-hint').count()).toBe(0);
    expect(await viewer.page.getByText(/Ctrl\s*\+\s*S/).count()).toBe(0);
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    owner.guard.assertLoopbackOnly();
    viewer.guard.assertLoopbackOnly();
  });
});
