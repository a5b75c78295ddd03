import { fileURLToPath } from 'node:url';

/** Root of the repository (for seeds-demo/ and docs/screenshots/). */
export const repoRoot = fileURLToPath(new URL('../../../../', import.meta.url));

/** BASE_URL of the stack `npm test` started (e.g. http://127.0.0.1:4320); the e2e tests need it. */
export function baseUrl(): string {
  const url = process.env.BASE_URL;
  if (!url) throw new Error('BASE_URL is not set: run the browser tests through `npm test`, which starts the stack.');
  return url.replace(/\/$/, '');
}

/** The SMTP fake's web API (maildev), e.g. http://127.0.0.1:4323. */
export function mailApiUrl(): string {
  const url = process.env.MAIL_API_URL;
  if (!url) throw new Error('MAIL_API_URL is not set: run the browser tests through `npm test`.');
  return url.replace(/\/$/, '');
}
