import type { ComputationView } from '@cribra/contracts';
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
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
  it('reads a range with both ends included, as everywhere, and shows stored blocks the same way', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 'tok' } },
      'GET /api/ledger/blocks': { body: { items: [{ index: 0, start: '0', end: '10000000', primeCount: '664579', firstPrime: '2', lastPrime: '9999991' }], total: 1, page: 1, pageSize: 100 } },
      'POST /api/ledger/computations': { status: 202, body: { id: 'c1', chunksTotal: 1 } },
    });
    renderWithApp(<LedgerSection />);
    expect((await screen.findByText(/block stored/)).textContent).toContain('first 0..9\u2009999\u2009999');
    expect(screen.getByText('Both ends included.')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('To'), { target: { value: '19999999' } });
    fireEvent.click(screen.getByRole('button', { name: 'Compute blocks' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    // The API's ranges are [from, to): the included end 19 999 999 is sent as 20 000 000.
    expect(calls.find((c) => c.method === 'POST')!.body).toEqual({ from: '0', to: '20000000' });
    expect((await screen.findByRole('status')).textContent).toBe('Queued: 1 block to compute.');
  }, 20_000);

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
    await userEvent.clear(screen.getByLabelText('To'));
    await userEvent.type(screen.getByLabelText('To'), '9999999999');
    await userEvent.click(screen.getByRole('button', { name: 'Compute blocks' }));
    const dialog = await screen.findByRole('dialog', { name: 'Start a long computation?' });
    expect(dialog.textContent).toMatch(/about 1 min 23 s/);
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });
});
