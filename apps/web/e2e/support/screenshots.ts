import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { repoRoot } from './env';

const dir = join(repoRoot, 'docs/screenshots');

/** Saves a PNG of the page as docs/screenshots/<name>.png (1280-wide viewport set by the test). */
export async function saveScreenshot(page: Page, name: string): Promise<void> {
  mkdirSync(dir, { recursive: true });
  await page.screenshot({ path: join(dir, `${name}.png`), fullPage: true });
}
