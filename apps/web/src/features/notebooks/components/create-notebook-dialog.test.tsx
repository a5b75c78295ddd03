import type { NotebookView } from '@cribra/contracts';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { CreateNotebookDialog } from './create-notebook-dialog';

const created: NotebookView = {
  id: 'n9',
  title: 'Twins near 10^9',
  summary: '',
  tags: ['twin-primes', 'wheel'],
  status: 'draft',
  revision: 1,
  requiredSignoffs: 1,
  owner: { id: 'u1', displayName: 'Ilse Marenko' },
  myRole: 'owner',
  cellCount: 0,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
  cells: [],
  members: [],
};

function open() {
  const onCreated = vi.fn();
  renderWithApp(<CreateNotebookDialog open onClose={vi.fn()} onCreated={onCreated} />);
  return { onCreated };
}

describe('CreateNotebookDialog', () => {
  it('sends tags split on commas and spaces, lower-cased, as the API stores them', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/notebooks': { status: 201, body: created },
    });
    const { onCreated } = open();
    await userEvent.type(screen.getByLabelText(/^Title/), 'Twins near 10^9');
    await userEvent.type(screen.getByLabelText(/^Tags/), 'Twin-primes, wheel');
    await userEvent.click(screen.getByRole('button', { name: /create/i }));
    await waitFor(() => expect(onCreated).toHaveBeenCalled());
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([
      { title: 'Twins near 10^9', summary: '', tags: ['twin-primes', 'wheel'] },
    ]);
  });

  it('refuses a tag the API would refuse, before asking it', async () => {
    const { calls } = mockFetch({ 'GET /api/auth/csrf': { body: { token: 't' } } });
    const { onCreated } = open();
    await userEvent.type(screen.getByLabelText(/^Title/), 'Twins');
    await userEvent.type(screen.getByLabelText(/^Tags/), 'twins, $gaps');
    await userEvent.click(screen.getByRole('button', { name: /create/i }));
    expect(await screen.findByText(/Tag “\$gaps” is not allowed/)).toBeTruthy();
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
    expect(onCreated).not.toHaveBeenCalled();
  });
});
