import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { repoRoot } from './env';

// The committed pictures are replaced only when asked (CRIBRA_UPDATE_SCREENSHOTS=1), so that a test
// run leaves the working tree as it was; otherwise they go to .data/screenshots (not committed).
const dir = join(repoRoot, process.env.CRIBRA_UPDATE_SCREENSHOTS === '1' ? 'docs/screenshots' : '.data/screenshots');

/**
 * Saves a PNG of the page as <dir>/<name>.png (1280-wide viewport set by the test).
 * Whole page by default; `fullPage: false` for dialogs, whose backdrop covers only the viewport.
 */
export async function saveScreenshot(page: Page, name: string, { fullPage = true } = {}): Promise<void> {
  mkdirSync(dir, { recursive: true });
  // Let field labels and transitions settle before the picture.
  await page.waitForTimeout(300);
  await page.screenshot({ path: join(dir, `${name}.png`), fullPage });
}
