import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { repoRoot } from './env';

const dir = join(repoRoot, 'docs/screenshots');

/**
 * Saves a PNG of the page as docs/screenshots/<name>.png (1280-wide viewport set by the test).
 * Whole page by default; `fullPage: false` for dialogs, whose backdrop covers only the viewport.
 */
export async function saveScreenshot(page: Page, name: string, { fullPage = true } = {}): Promise<void> {
  mkdirSync(dir, { recursive: true });
  // Let field labels and transitions settle before the picture.
  await page.waitForTimeout(300);
  await page.screenshot({ path: join(dir, `${name}.png`), fullPage });
}
