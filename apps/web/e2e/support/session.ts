import type { Browser, Page } from 'playwright-core';
import type { DemoUser } from './demo-users';
import { baseUrl } from './env';
import { guardLoopback, type LoopbackGuard } from './loopback-guard';
import { signInThroughUi } from './sign-in-ui';

export interface Session {
  page: Page;
  guard: LoopbackGuard;
}

/** A browser context of its own (one person), signed in through the sign-in page. */
export async function signedInSession(browser: Browser, user: Pick<DemoUser, 'email' | 'password'>): Promise<Session> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const guard = await guardLoopback(context);
  const page = await context.newPage();
  await page.goto(`${baseUrl()}/sign-in`);
  await signInThroughUi(page, user);
  await page.getByRole('heading', { name: 'Notebooks' }).waitFor();
  return { page, guard };
}
