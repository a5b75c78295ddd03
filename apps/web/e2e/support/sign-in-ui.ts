import type { Page } from 'playwright-core';
import type { DemoUser } from './demo-users';

/** Signs in through the sign-in page's form (the page must already be on /sign-in). */
export async function signInThroughUi(page: Page, user: Pick<DemoUser, 'email' | 'password'>): Promise<void> {
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password').fill(user.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}
