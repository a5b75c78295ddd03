import { cleanup, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import SignInPage from './sign-in-page';
import SignUpPage from './sign-up-page';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const routes = [
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/sign-up', element: <SignUpPage /> },
];

describe('sign-in and sign-up reached from an invitation', () => {
  it('fill in the invited address and pass it on to the other page', async () => {
    mockFetch({});
    renderRoutes(routes, '/sign-in?next=%2Finvitations%2Ftok1&email=noor%40example.org');
    expect(((await screen.findByLabelText(/E-mail/)) as HTMLInputElement).value).toBe('noor@example.org');
    const create = screen.getByRole('link', { name: 'Create an account' });
    expect(create.getAttribute('href')).toBe('/sign-up?next=%2Finvitations%2Ftok1&email=noor%40example.org');
    cleanup();
    renderRoutes(routes, '/sign-up?email=noor%40example.org');
    expect(((await screen.findByLabelText(/E-mail/)) as HTMLInputElement).value).toBe('noor@example.org');
  });

  it('leave the address empty otherwise', async () => {
    mockFetch({});
    renderRoutes(routes, '/sign-in');
    expect(((await screen.findByLabelText(/E-mail/)) as HTMLInputElement).value).toBe('');
  });
});
