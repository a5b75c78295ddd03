import { CSRF_HEADER } from '@cribra/contracts';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { apiError, mockFetch } from '../test-utils/mock-fetch';
import { api, resetCsrfToken } from './api-client';
import { ApiRequestError } from './api-error';

afterEach(() => {
  resetCsrfToken();
  vi.unstubAllGlobals();
});

/** The error a failing request throws (the test fails if it resolves). */
async function caught(p: Promise<unknown>): Promise<ApiRequestError> {
  try {
    await p;
  } catch (e) {
    return e as ApiRequestError;
  }
  throw new Error('expected the request to fail');
}

const csrfRefusal = apiError(403, 'Forbidden', 'invalid csrf token');

describe('api client', () => {
  it('sends GET without asking for a CSRF token', async () => {
    const { calls } = mockFetch({ 'GET /api/auth/me': { body: { id: 'u1' } } });
    await expect(api.get('/auth/me')).resolves.toEqual({ id: 'u1' });
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['GET /api/auth/me']);
    expect(calls[0].headers[CSRF_HEADER]).toBeUndefined();
  });

  it('fetches the CSRF token once and sends it on every state-changing request', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/signin': { body: { id: 'u1' } },
      'PATCH /api/admin/users/u2': { body: { id: 'u2' } },
    });
    await api.post('/auth/signin', { email: 'a@b.cd', password: 'x' });
    await api.patch('/admin/users/u2', { siteRole: 'admin' });
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      'GET /api/auth/csrf',
      'POST /api/auth/signin',
      'PATCH /api/admin/users/u2',
    ]);
    expect(calls[1].headers[CSRF_HEADER]).toBe('tok-1');
    expect(calls[2].headers[CSRF_HEADER]).toBe('tok-1');
    expect(calls[1].body).toEqual({ email: 'a@b.cd', password: 'x' });
    expect(calls[1].headers['content-type']).toBe('application/json');
  });

  it('retries once with a fresh token after a CSRF refusal', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': [{ body: { token: 'stale' } }, { body: { token: 'fresh' } }],
      'POST /api/auth/signout': (req) => (req.headers[CSRF_HEADER] === 'fresh' ? { status: 204 } : csrfRefusal),
    });
    await expect(api.post('/auth/signout')).resolves.toBeUndefined();
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.headers[CSRF_HEADER])).toEqual(['stale', 'fresh']);
  });

  it('gives up after the second CSRF refusal instead of looping', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/auth/signout': csrfRefusal,
    });
    const err = await caught(api.post('/auth/signout'));
    expect(err).toBeInstanceOf(ApiRequestError);
    expect(err.statusCode).toBe(403);
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2);
  });

  it('does not retry a 403 that is a permission refusal', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PATCH /api/admin/users/u1': apiError(403, 'Forbidden', 'Only administrators may change roles.'),
    });
    const err = await caught(api.patch('/admin/users/u1', { siteRole: 'admin' }));
    expect(err.message).toBe('Only administrators may change roles.');
    expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(1);
  });

  it('turns the shared error shape into a typed error with field messages', async () => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/auth/signup': apiError(400, 'Bad Request', 'Validation failed', [
        { field: 'email', messages: ['email must be an email'] },
        { field: 'password', message: 'password is too short' },
      ]),
    });
    const err = await caught(api.post('/auth/signup', {}));
    expect(err).toBeInstanceOf(ApiRequestError);
    expect(err).toMatchObject({ statusCode: 400, error: 'Bad Request', message: 'Validation failed' });
    expect(err.fieldErrors).toEqual({ email: 'email must be an email', password: 'password is too short' });
  });

  it('reads field messages given as a map too', () => {
    const err = new ApiRequestError({ statusCode: 400, error: 'Bad Request', message: 'x', details: { email: ['bad', 'worse'] } });
    expect(err.fieldErrors).toEqual({ email: 'bad; worse' });
  });

  it('makes a typed error from an answer that is not the shared shape', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response('<html>bad gateway</html>', { status: 502, statusText: 'Bad Gateway' })));
    const err = await caught(api.get('/health'));
    expect(err).toBeInstanceOf(ApiRequestError);
    expect(err).toMatchObject({ statusCode: 502, error: 'Bad Gateway', message: 'The server answered 502.' });
  });

  it('reports an unreachable server as statusCode 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => { throw new TypeError('Failed to fetch'); }));
    const err = await caught(api.get('/health'));
    expect(err).toBeInstanceOf(ApiRequestError);
    expect(err.isNetwork).toBe(true);
    expect(err.message).toBe('The server could not be reached.');
  });

  it('puts query parameters in the URL and leaves out undefined ones', async () => {
    const { calls } = mockFetch({ 'GET /api/notebooks': { body: [] } });
    await api.get('/notebooks', { query: { q: 'twin primes', tag: undefined, page: 2 } });
    expect(calls[0].url).toBe('/api/notebooks?q=twin+primes&page=2');
  });
});
