import type { CellView } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import { CellTitle } from './cell-title';

const cell: CellView = {
  id: 'c1', notebookId: 'n1', kind: 'query', title: 'Gap counts', source: 'show gaps(13)', position: 0, revision: 3,
  author: { id: 'u1', displayName: 'Ilse' }, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z', latestRun: null,
};

describe('CellTitle', () => {
  it('shows the title and renames it with the cell revision it started from', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) => ({ body: { ...cell, title: (req.body as { title: string }).title } }),
    });
    renderRoutes([{ path: '/', element: <CellTitle cell={cell} index={0} canEdit /> }], '/');
    await userEvent.click(screen.getByRole('button', { name: 'Gap counts (rename cell 1)' }));
    const field = screen.getByLabelText('Title of cell 1');
    await userEvent.clear(field);
    await userEvent.type(field, 'Gaps at level 13{Enter}');
    const put = calls.find((c) => c.method === 'PUT');
    expect(put?.body).toEqual({ revision: 3, title: 'Gaps at level 13' });
  });

  it('is plain text for readers', () => {
    mockFetch({});
    renderRoutes([{ path: '/', element: <CellTitle cell={cell} index={0} canEdit={false} /> }], '/');
    expect(screen.getByRole('heading', { name: 'Gap counts' })).toBeTruthy();
    expect(screen.queryByRole('button')).toBeNull();
  });
});
