import type { ComputationView } from '@cribra/contracts';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../../lib/api-client';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { LedgerSection } from './ledger-section';

afterEach(() => {
  cleanup();
  resetCsrfToken();
  vi.unstubAllGlobals();
});

const computation = (over: Partial<ComputationView>): ComputationView => ({
  id: 'c1', kind: 'ledger', params: { from: '0', to: '30000000' }, status: 'running', chunksTotal: 3, chunksDone: 0,
  requestedBy: null, createdAt: new Date().toISOString(), startedAt: new Date().toISOString(), finishedAt: null, error: null, ...over,
});

describe('LedgerSection', () => {
  it('follows a running computation: progress, the stored-block summary without a reload, and Cancel', async () => {
    let done = 0;
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'GET /api/ledger/blocks': () => ({ body: { items: [], total: done, page: 1, pageSize: 100 } }),
      'GET /api/computations': () => {
        done = Math.min(3, done + 1);
        return { body: [computation({ chunksDone: done })] };
      },
      'POST /api/computations/c1/cancel': { body: computation({ status: 'cancelled', chunksDone: 2, finishedAt: new Date().toISOString() }) },
    });
    renderWithApp(<LedgerSection />);
    await screen.findByText(/Running: [12] of 3 blocks/, undefined, { timeout: 5_000 });
    await screen.findByText(/[12] blocks? stored/, undefined, { timeout: 5_000 });
    await userEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.url.endsWith('/computations/c1/cancel'))).toBe(true));
  });

  it('asks before a request estimated above a minute, with the estimate', async () => {
    const { calls } = mockFetch({
      'GET /api/ledger/blocks': { body: { items: [], total: 0, page: 1, pageSize: 100 } },
      'GET /api/computations': { body: [] },
    });
    renderWithApp(<LedgerSection />);
    await userEvent.clear(screen.getByLabelText('From'));
    await userEvent.type(screen.getByLabelText('From'), '0');
    await userEvent.clear(screen.getByLabelText('To (exclusive)'));
    await userEvent.type(screen.getByLabelText('To (exclusive)'), '10000000000');
    await userEvent.click(screen.getByRole('button', { name: 'Compute blocks' }));
    const dialog = await screen.findByRole('dialog', { name: 'Start a long computation?' });
    expect(dialog.textContent).toMatch(/about 1 min 23 s/);
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });
});
