import type { ReviewStateView, VerificationSummary } from '@cribra/contracts';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { ReviewForm } from './review-form';

const state = { revisionDigest: 'd'.repeat(64), status: 'in_review' } as ReviewStateView;
const verification = (over: Partial<VerificationSummary>) =>
  ({ id: 'v1', status: 'done', allSame: true, revisionDigest: state.revisionDigest, ...over }) as VerificationSummary;

describe('ReviewForm', () => {
  it('offers a sign-off only after a clean re-verify of this same revision; otherwise says what to do first', async () => {
    mockFetch({});
    const onReverify = vi.fn();
    const props = { notebookId: 'n1', state, onChanged: vi.fn(), onReverify, reverifying: false };
    const { unmount } = renderWithApp(<ReviewForm {...props} verification={verification({ allSame: false })} />);
    await screen.findByText(/did not reproduce every cell/);
    expect(screen.queryByRole('button', { name: 'Sign off' })).toBeNull();
    unmount();
    // A re-verify of another revision (or none of the reviewer's own) leaves the re-verify to do.
    const second = renderWithApp(<ReviewForm {...props} verification={verification({ revisionDigest: 'e'.repeat(64) })} />);
    await userEvent.click(await screen.findByRole('button', { name: 'Re-verify this revision yourself' }));
    expect(onReverify).toHaveBeenCalledTimes(1);
    expect(screen.queryByRole('button', { name: 'Sign off' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Ask for changes' }).hasAttribute('disabled')).toBe(false);
    second.unmount();
    renderWithApp(<ReviewForm {...props} verification={null} />);
    await screen.findByRole('button', { name: 'Re-verify this revision yourself' });
    expect(screen.queryByRole('button', { name: 'Sign off' })).toBeNull();
  });

  it('asks for a comment, then binds the sign-off to the digest and the re-verify', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/notebooks/n1/reviews': { status: 201, body: { id: 'r1', decision: 'signoff' } },
    });
    const onChanged = vi.fn();
    renderWithApp(<ReviewForm notebookId="n1" state={state} verification={verification({})} onChanged={onChanged} onReverify={vi.fn()} reverifying={false} />);
    await userEvent.click(await screen.findByRole('button', { name: 'Sign off' }));
    expect(screen.getByText(/Say what you checked/)).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
    await userEvent.type(screen.getByLabelText(/Review comment/), 'Same digests for every cell.');
    await userEvent.click(screen.getByRole('button', { name: 'Sign off' }));
    await waitFor(() => expect(onChanged).toHaveBeenCalled());
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
      decision: 'signoff',
      comment: 'Same digests for every cell.',
      revisionDigest: state.revisionDigest,
      verificationId: 'v1',
    });
  });
});
