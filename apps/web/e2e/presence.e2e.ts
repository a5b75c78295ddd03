import type { CellView, NotebookView } from '@cribra/contracts';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { pageApi } from './support/page-api';
import { saveScreenshot } from './support/screenshots';
import { type Session, signedInSession } from './support/session';

// Presence: who else has the notebook open, and who is editing which cell, seen before a conflict.
describe('presence in a notebook', () => {
  let browser: Browser;
  let a: Session;
  let b: Session;
  let notebookId = '';
  let cells: CellView[] = [];
  const ilse = demoUser((u) => u.email.startsWith('ilse.'));
  const teodor = demoUser((u) => u.email.startsWith('teodor.'));

  beforeAll(async () => {
    browser = await launchBrowser();
    a = await signedInSession(browser, ilse);
    b = await signedInSession(browser, teodor);
    const nb = await pageApi<NotebookView>(a.page, 'POST', '/notebooks', { title: `Presence ${Date.now()}` });
    notebookId = nb.id;
    await pageApi(a.page, 'POST', `/notebooks/${nb.id}/members`, { email: teodor.email, role: 'editor' });
    for (const source of ['show 1', 'show 2']) cells.push(await pageApi<CellView>(a.page, 'POST', `/notebooks/${nb.id}/cells`, { kind: 'query', source }));
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shows the other member on the notebook and on the cell they edit, and drops them when their tab closes', async () => {
    for (const s of [a, b]) await s.page.goto(`${baseUrl()}/notebooks/${notebookId}`);
    const here = a.page.getByRole('region', { name: 'Also here' });
    await here.getByText('Teodor Quill').waitFor({ timeout: 15_000 });

    await b.page.locator(`section[data-cell-id="${cells[1].id}"] .monaco-editor`).click();
    const chip = a.page.locator(`section[data-cell-id="${cells[1].id}"]`).getByTestId('cell-presence');
    await chip.waitFor({ timeout: 5_000 });
    expect(await chip.innerText()).toBe('Teodor Quill is editing');
    expect(await a.page.locator(`section[data-cell-id="${cells[0].id}"]`).getByTestId('cell-presence').count()).toBe(0);
    await saveScreenshot(a.page, 'presence', { fullPage: false });

    await b.page.close();
    await here.waitFor({ state: 'detached', timeout: 10_000 });
  });

  it('never sent a request to a host other than 127.0.0.1', () => {
    a.guard.assertLoopbackOnly();
    b.guard.assertLoopbackOnly();
  });
});
