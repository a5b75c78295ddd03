import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { LedgerSection } from './ledger-section';

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
});
