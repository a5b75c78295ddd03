import type { NotebookSummary } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import NotebooksPage from './notebooks-page';

const nb: NotebookSummary = {
  id: 'n1',
  title: 'Sixes in the wheel',
  summary: 'Counting gaps 6 level by level.',
  tags: ['wheel'],
  status: 'in_review',
  revision: 4,
  requiredSignoffs: 1,
  owner: { id: 'u1', displayName: 'Ilse Marenko' },
  myRole: 'owner',
  cellCount: 5,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-02T00:00:00Z',
};

describe('NotebooksPage', () => {
  it('lists notebooks and sends search and filters to the API', async () => {
    const { calls } = mockFetch({
      'GET /api/notebooks': (req) => ({
        body: new URL(req.url, 'http://x').searchParams.get('q') === 'nothing'
          ? { items: [], total: 0, page: 1, pageSize: 20 }
          : { items: [nb], total: 1, page: 1, pageSize: 20 },
      }),
    });
    const { router } = renderRoutes([{ path: '/notebooks', element: <NotebooksPage /> }], '/notebooks');
    expect((await screen.findByRole('link', { name: 'Sixes in the wheel' })).getAttribute('href')).toBe('/notebooks/n1');
    expect(screen.getByText('In review')).toBeTruthy();

    await userEvent.type(screen.getByLabelText(/Search titles/), 'nothing');
    expect(await screen.findByText('No notebook matches', undefined, { timeout: 3000 })).toBeTruthy();
    const last = new URL(calls.at(-1)!.url, 'http://x').searchParams;
    expect(last.get('q')).toBe('nothing');
    expect(router.state.location.search).toBe('?q=nothing');

    await userEvent.click(screen.getByRole('button', { name: 'Clear the filters' }));
    // Back to the unfiltered list (answered from the cache of the first request).
    expect(await screen.findByRole('link', { name: 'Sixes in the wheel' }, { timeout: 3000 })).toBeTruthy();
    expect(router.state.location.search).toBe('');
  });
});
