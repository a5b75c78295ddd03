import { screen } from '@testing-library/react';
import { useLocation } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import { RequireSignedIn } from './require-signed-in';

function Where() {
  const l = useLocation();
  return <p>sign-in page at {l.pathname + l.search}</p>;
}

const routes = [
  { path: '/sign-in', element: <Where /> },
  { path: '/data', element: <RequireSignedIn><p>private data</p></RequireSignedIn> },
];

describe('RequireSignedIn', () => {
  it('sends a signed-out reader to sign-in with the way back', async () => {
    mockFetch({ 'GET /api/auth/me': apiError(401, 'Unauthorized', 'Not signed in') });
    const { router } = renderRoutes(routes, '/data?level=13#top');
    expect(await screen.findByText(/sign-in page at/)).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe('/data?level=13#top');
    expect(screen.queryByText('private data')).toBeNull();
  });

  it('shows the page to a signed-in reader', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { id: 'u1', email: 'a@b.cd', displayName: 'A', siteRole: 'member', createdAt: '2026-01-01T00:00:00Z' } },
    });
    const { router } = renderRoutes(routes, '/data');
    expect(await screen.findByText('private data')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/data');
  });

  it('offers a retry rather than a redirect when the server fails', async () => {
    mockFetch({ 'GET /api/auth/me': apiError(503, 'Service Unavailable', 'Database is down') });
    renderRoutes(routes, '/data');
    expect(await screen.findByText(/Database is down/, undefined, { timeout: 5000 })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});
