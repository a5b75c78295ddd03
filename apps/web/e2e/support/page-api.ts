import type { Page } from 'playwright-core';

/**
 * Calls the API from inside a signed-in page (its session cookie and a CSRF token), for test
 * setup that is not itself under test. Throws on a non-2xx answer, with the API's message.
 */
export async function pageApi<T = unknown>(page: Page, method: string, path: string, body?: unknown): Promise<T> {
  const res = await page.evaluate(
    async ({ method, path, body }) => {
      const headers: Record<string, string> = { 'content-type': 'application/json' };
      if (method !== 'GET') headers['x-csrf-token'] = (await (await fetch('/api/auth/csrf')).json()).token;
      const r = await fetch(`/api${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
      const text = await r.text();
      return { status: r.status, text };
    },
    { method, path, body },
  );
  if (res.status >= 300) throw new Error(`${method} ${path} → ${res.status}: ${res.text}`);
  return (res.text ? JSON.parse(res.text) : undefined) as T;
}

/** The text of a Monaco editor inside `root` (its rendered lines; spaces come back as spaces). */
export async function monacoText(page: Page, selector: string): Promise<string> {
  return page.evaluate((sel) => {
    const lines = [...document.querySelectorAll(`${sel} .view-line`)] as HTMLElement[];
    return lines
      .sort((a, b) => parseFloat(a.style.top) - parseFloat(b.style.top))
      .map((l) => l.innerText.replace(/\u00a0/g, ' '))
      .join('\n');
  }, selector);
}
