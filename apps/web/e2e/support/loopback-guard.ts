import type { BrowserContext } from 'playwright-core';

export interface LoopbackGuard {
  /** Every request the pages made, as "METHOD url". */
  readonly requests: string[];
  /** Requests aimed at any host other than 127.0.0.1 (aborted before they left). */
  readonly offenders: string[];
  /** Throws, listing the offenders, if any request tried to leave loopback. */
  assertLoopbackOnly(): void;
}

// Schemes that never touch the network.
const LOCAL_SCHEMES = new Set(['data:', 'blob:', 'about:', 'chrome-extension:']);

export function isLoopback(url: string): boolean {
  const u = new URL(url);
  if (LOCAL_SCHEMES.has(u.protocol)) return true;
  return u.hostname === '127.0.0.1';
}

/**
 * Logs every request of the context and aborts those bound for another host, so nothing leaves
 * the machine even when the app misbehaves; the test then fails through assertLoopbackOnly().
 */
export async function guardLoopback(context: BrowserContext): Promise<LoopbackGuard> {
  const requests: string[] = [];
  const offenders: string[] = [];
  await context.route('**/*', (route) => {
    const req = route.request();
    requests.push(`${req.method()} ${req.url()}`);
    if (isLoopback(req.url())) return route.continue();
    offenders.push(`${req.method()} ${req.url()}`);
    return route.abort('blockedbyclient');
  });
  // Service workers and some prefetches bypass routing; the request event still sees them.
  context.on('request', (req) => {
    if (!isLoopback(req.url()) && !offenders.includes(`${req.method()} ${req.url()}`)) offenders.push(`${req.method()} ${req.url()}`);
  });
  return {
    requests,
    offenders,
    assertLoopbackOnly() {
      if (offenders.length) throw new Error(`Requests left 127.0.0.1:\n  ${offenders.join('\n  ')}`);
    },
  };
}
