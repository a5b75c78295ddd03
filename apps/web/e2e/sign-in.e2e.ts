import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './support/browser';
import { demoUser } from './support/demo-users';
import { baseUrl } from './support/env';
import { guardLoopback, type LoopbackGuard } from './support/loopback-guard';
import { saveScreenshot } from './support/screenshots';
import { signInThroughUi } from './support/sign-in-ui';

describe('signing in through the browser', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let guard: LoopbackGuard;

  beforeAll(async () => {
    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    guard = await guardLoopback(context);
    page = await context.newPage();
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('sends a signed-out reader to sign-in, then back to the page asked for', async () => {
    await page.goto(`${baseUrl()}/data`);
    await page.waitForURL(/\/sign-in\?next=%2Fdata/);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await saveScreenshot(page, 'sign-in');

    // A wrong password gets the API's message, not a stack trace.
    const user = demoUser((u) => u.siteRole === 'admin');
    await signInThroughUi(page, { email: user.email, password: `${user.password}-wrong` });
    await page.getByRole('alert').waitFor();
    expect(await page.getByRole('alert').innerText()).not.toMatch(/at .*\.js|Error:/);

    await signInThroughUi(page, user);
    await page.waitForURL(/\/data$/);
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    expect(await page.getByTestId('signed-in-as').innerText()).toBe(user.displayName);
    for (const label of ['Notebooks', 'Data', 'Account', 'Admin']) {
      expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label }).count()).toBe(1);
    }
  });

  it('shows the account and admin pages of the signed-in admin', async () => {
    await page.getByRole('link', { name: 'Account' }).click();
    await page.getByRole('heading', { name: 'Account' }).waitFor();
    await saveScreenshot(page, 'account');
    await page.getByRole('link', { name: 'Admin' }).click();
    await page.getByRole('table', { name: 'Users' }).waitFor();
    await saveScreenshot(page, 'admin-users');
  });

  it('signs out and lands on sign-in again', async () => {
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${baseUrl()}/no/such/page`);
    await page.getByRole('heading', { name: 'Nothing at this address' }).waitFor();
    await saveScreenshot(page, 'not-found');
  });

  it('made no request to a host other than 127.0.0.1', () => {
    expect(guard.requests.length).toBeGreaterThan(5);
    expect(guard.requests.every((r) => r.includes('127.0.0.1'))).toBe(true);
    guard.assertLoopbackOnly();
  });
});
