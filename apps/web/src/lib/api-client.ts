import { CSRF_HEADER } from '@cribra/contracts';
import { ApiRequestError, isApiErrorBody } from './api-error';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface RequestOptions {
  method?: Method;
  body?: unknown;
  signal?: AbortSignal;
  /** Extra query string parameters; undefined values are left out. */
  query?: Record<string, string | number | boolean | undefined>;
  /** Let the request outlive the page (a tab saying goodbye as it closes). */
  keepalive?: boolean;
}

const API_BASE = '/api';
const SAFE_METHODS = new Set<Method>(['GET']);

// One CSRF token per page life; fetched lazily, refreshed once after a CSRF refusal.
let csrfToken: string | null = null;
let csrfPending: Promise<string> | null = null;

/** Forget the cached CSRF token (after sign-in/out the server may rotate it). */
export function resetCsrfToken(): void {
  csrfToken = null;
  csrfPending = null;
}

async function getCsrfToken(signal?: AbortSignal): Promise<string> {
  if (csrfToken) return csrfToken;
  csrfPending ??= send<{ token: string }>('/auth/csrf', { signal })
    .then((r) => (csrfToken = r.token))
    .finally(() => {
      csrfPending = null;
    });
  return csrfPending;
}

/** A 403 caused by a missing or stale CSRF token, as opposed to a permission refusal. */
function isCsrfRefusal(err: ApiRequestError): boolean {
  return err.statusCode === 403 && /csrf/i.test(`${err.error} ${err.message}`);
}

function buildUrl(path: string, query?: RequestOptions['query']): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query ?? {})) if (v !== undefined) params.set(k, String(v));
  const qs = params.toString();
  return `${API_BASE}${path}${qs ? `?${qs}` : ''}`;
}

async function send<T>(path: string, opts: RequestOptions, csrf?: string): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  // Form data (file uploads) sets its own multipart content type with the boundary.
  const isForm = typeof FormData !== 'undefined' && opts.body instanceof FormData;
  if (opts.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  if (csrf) headers[CSRF_HEADER] = csrf;
  let res: Response;
  try {
    res = await fetch(buildUrl(path, opts.query), {
      method: opts.method ?? 'GET',
      headers,
      body: opts.body === undefined ? undefined : isForm ? (opts.body as FormData) : JSON.stringify(opts.body),
      credentials: 'same-origin',
      signal: opts.signal,
      keepalive: opts.keepalive,
    });
  } catch (e) {
    if ((e as Error)?.name === 'AbortError') throw e;
    throw new ApiRequestError({ statusCode: 0, error: 'Network', message: 'The server could not be reached.' });
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let data: unknown = undefined;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = text;
    }
  }
  if (!res.ok) {
    throw new ApiRequestError(
      isApiErrorBody(data)
        ? data
        : { statusCode: res.status, error: res.statusText || 'Error', message: `The server answered ${res.status}.` },
    );
  }
  return data as T;
}

/**
 * Calls `/api${path}` and returns the parsed JSON body (undefined for 204).
 * State-changing methods carry the CSRF token; a CSRF refusal refreshes the token and retries once.
 * @throws ApiRequestError for every non-2xx answer (statusCode 0 when the server is unreachable).
 */
export async function apiRequest<T>(path: string, opts: RequestOptions = {}): Promise<T> {
  const method = opts.method ?? 'GET';
  if (SAFE_METHODS.has(method)) return send<T>(path, opts);
  const token = await getCsrfToken(opts.signal);
  try {
    return await send<T>(path, opts, token);
  } catch (err) {
    if (!(err instanceof ApiRequestError) || !isCsrfRefusal(err)) throw err;
    resetCsrfToken();
    return send<T>(path, opts, await getCsrfToken(opts.signal));
  }
}

/** Shorthands used by the feature fetchers. */
export const api = {
  get: <T>(path: string, opts?: Omit<RequestOptions, 'method' | 'body'>) => apiRequest<T>(path, { ...opts, method: 'GET' }),
  post: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'POST', body }),
  put: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'PUT', body }),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'PATCH', body }),
  delete: <T>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
};
