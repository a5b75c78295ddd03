import { fileURLToPath } from 'node:url';

/** Root of the repository (for seeds-demo/ and docs/screenshots/). */
export const repoRoot = fileURLToPath(new URL('../../../../', import.meta.url));

const isHttp = (v: string | undefined): v is string => !!v && /^https?:\/\//.test(v);

/**
 * The stack `npm test` started (e.g. http://127.0.0.1:4320). Vitest overwrites process.env.BASE_URL
 * with Vite's base path ('/'), so an absolute BASE_URL is used when it survives, else PUBLIC_URL,
 * which the launcher sets to the same address.
 */
export function baseUrl(): string {
  const url = [process.env.E2E_BASE_URL, process.env.BASE_URL, process.env.PUBLIC_URL].find(isHttp);
  if (!url) throw new Error('No stack address (BASE_URL / PUBLIC_URL): run the browser tests through `npm test`, which starts the stack.');
  return url.replace(/\/$/, '');
}

/** The SMTP fake's web API (maildev), e.g. http://127.0.0.1:4323. */
export function mailApiUrl(): string {
  const url = process.env.MAIL_API_URL;
  if (!url) throw new Error('MAIL_API_URL is not set: run the browser tests through `npm test`.');
  return url.replace(/\/$/, '');
}
