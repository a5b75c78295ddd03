import { vi } from 'vitest';

export interface Reply {
  status?: number;
  body?: unknown;
  /** Answer only once this settles (to hold one request back while others go through). */
  after?: Promise<unknown>;
}
export type Handler = (req: { method: string; url: string; headers: Record<string, string>; body: unknown }) => Reply;

export interface RecordedCall {
  method: string;
  url: string;
  headers: Record<string, string>;
  body: unknown;
}

/**
 * Replaces global fetch with a router of `"METHOD /path"` → handler (or a queue of replies used in turn).
 * Unrouted requests answer 404 in the shared error shape, so a test never hangs on a forgotten route.
 */
export function mockFetch(routes: Record<string, Handler | Reply | Reply[]>) {
  const calls: RecordedCall[] = [];
  const fn = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = typeof input === 'string' ? input : input.toString();
    const method = (init.method ?? 'GET').toUpperCase();
    const headers = Object.fromEntries(Object.entries((init.headers ?? {}) as Record<string, string>).map(([k, v]) => [k.toLowerCase(), v]));
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    const call = { method, url, headers, body };
    calls.push(call);
    const route = routes[`${method} ${url.split('?')[0]}`];
    let reply: Reply;
    if (!route) reply = { status: 404, body: { statusCode: 404, error: 'Not Found', message: `No mock for ${method} ${url}` } };
    else if (typeof route === 'function') reply = route(call);
    else if (Array.isArray(route)) reply = route.length > 1 ? route.shift()! : route[0];
    else reply = route;
    if (reply.after) await reply.after;
    const status = reply.status ?? 200;
    return new Response(status === 204 || reply.body === undefined ? null : JSON.stringify(reply.body), {
      status,
      headers: { 'content-type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fn);
  return { fn, calls };
}

export const apiError = (statusCode: number, error: string, message: string, details?: unknown): Reply => ({
  status: statusCode,
  body: { statusCode, error, message, details },
});
