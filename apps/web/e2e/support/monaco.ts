import type { Locator, Page } from 'playwright-core';

/**
 * Types into the Monaco editor inside `cell` key by key, as a person would (auto-closing brackets
 * and quotes included). Lines after an indented one inherit its indent, so keep indented lines last.
 */
export async function typeInEditor(page: Page, cell: Locator, text: string): Promise<void> {
  const editor = cell.locator('.monaco-editor');
  await editor.waitFor();
  await editor.click();
  await page.keyboard.type(text);
}
