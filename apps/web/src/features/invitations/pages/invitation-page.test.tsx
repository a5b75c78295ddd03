import type { InvitationPreview } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import InvitationPage from './invitation-page';

const preview: InvitationPreview = {
  notebookId: 'n1',
  notebookTitle: 'Sixes in the wheel',
  role: 'reviewer',
  email: 'noor@example.org',
  invitedBy: { id: 'u1', displayName: 'Ilse Marenko' },
  expiresAt: '2026-12-08T00:00:00Z',
  accountExists: true,
};
const routes = [{ path: '/invitations/:token', element: <InvitationPage /> }];
const signedOut = apiError(401, 'Unauthorized', 'Not signed in');

describe('InvitationPage', () => {
  it('sends a signed-out invitee with an account to sign in and back', async () => {
    mockFetch({ 'GET /api/invitations/token/tok1': { body: preview }, 'GET /api/auth/me': signedOut });
    renderRoutes(routes, '/invitations/tok1');
    const link = await screen.findByRole('link', { name: 'Sign in as noor@example.org to accept' });
    // The sign-in page fills in the invited address from `email`.
    expect(link.getAttribute('href')).toBe('/sign-in?next=%2Finvitations%2Ftok1&email=noor%40example.org');
    expect(screen.getByText(/Sixes in the wheel/)).toBeTruthy();
  });

  it('offers a new invitee an account for the invited address', async () => {
    mockFetch({ 'GET /api/invitations/token/tok1': { body: { ...preview, accountExists: false } }, 'GET /api/auth/me': signedOut });
    renderRoutes(routes, '/invitations/tok1');
    expect(await screen.findByRole('button', { name: 'Create account and join' })).toBeTruthy();
    expect((screen.getByLabelText(/E-mail/) as HTMLInputElement).value).toBe('noor@example.org');
  });

  it('explains a used or expired link', async () => {
    mockFetch({ 'GET /api/invitations/token/old': apiError(410, 'Gone', 'gone', { reason: 'expired' }), 'GET /api/auth/me': signedOut });
    renderRoutes(routes, '/invitations/old');
    expect(await screen.findByText(/already used, revoked or has expired/)).toBeTruthy();
  });
});
