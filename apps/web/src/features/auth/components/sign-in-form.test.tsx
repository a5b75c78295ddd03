import { CSRF_HEADER } from '@cribra/contracts';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { SignInForm } from './sign-in-form';

const ada = { id: 'u1', email: 'ada@example.org', displayName: 'Ada', siteRole: 'member', createdAt: '2026-01-01T00:00:00Z' };

describe('SignInForm', () => {
  it('checks the fields before sending anything', async () => {
    const { fn } = mockFetch({});
    const onSignedIn = vi.fn();
    renderWithApp(<SignInForm onSignedIn={onSignedIn} />);
    await userEvent.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(screen.getByText('Enter your e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();
    await userEvent.type(screen.getByLabelText(/E-mail/), 'ada@');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(screen.getByText('This does not look like an e-mail address.')).toBeTruthy();
    expect(fn).not.toHaveBeenCalled();
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('sends the credentials with the CSRF token and reports the signed-in user', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 'tok' } },
      'POST /api/auth/signin': { body: ada },
    });
    const onSignedIn = vi.fn();
    renderWithApp(<SignInForm onSignedIn={onSignedIn} />);
    await userEvent.type(await screen.findByLabelText(/E-mail/), ' ada@example.org ');
    await userEvent.type(screen.getByLabelText(/Password/), 'correct horse');
    await userEvent.keyboard('{Enter}');
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(ada, expect.anything(), undefined, expect.anything()));
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.body).toEqual({ email: 'ada@example.org', password: 'correct horse' });
    expect(post.headers[CSRF_HEADER]).toBe('tok');
  });

  it('shows the API message for wrong credentials and a plain one for the rate limit', async () => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 'tok' } },
      'POST /api/auth/signin': [
        apiError(401, 'Unauthorized', 'Wrong e-mail or password.'),
        apiError(429, 'Too Many Requests', 'ThrottlerException: Too Many Requests'),
      ],
    });
    const onSignedIn = vi.fn();
    renderWithApp(<SignInForm onSignedIn={onSignedIn} />);
    await userEvent.type(await screen.findByLabelText(/E-mail/), 'ada@example.org');
    await userEvent.type(screen.getByLabelText(/Password/), 'wrong');
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Wrong e-mail or password.')).toBeTruthy();
    await userEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/Too many sign-in attempts/)).toBeTruthy();
    expect(onSignedIn).not.toHaveBeenCalled();
  });
});
