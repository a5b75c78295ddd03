import type { MemberRole, NotebookView, SiteRole } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { CollaborationPanel } from './collaboration-panel';

const notebook = (myRole: MemberRole | null) =>
  ({ id: 'n1', status: 'draft', revision: 3, myRole, members: [], cells: [] }) as unknown as NotebookView;

function renderPanel(myRole: MemberRole | null, siteRole: SiteRole = 'member') {
  return renderWithApp(<CollaborationPanel notebook={notebook(myRole)} userId="u1" siteRole={siteRole} onNotebookChanged={vi.fn()} />);
}

describe('CollaborationPanel history tab', () => {
  it.each(['editor', 'reviewer', 'viewer'] as const)('is not offered to a %s', async (role) => {
    const { calls } = mockFetch({});
    renderPanel(role);
    expect(await screen.findByRole('tab', { name: 'Review' })).toBeTruthy();
    expect(screen.queryByRole('tab', { name: 'History' })).toBeNull();
    expect(calls.some((c) => c.url.includes('/audit'))).toBe(false);
  });

  it('is offered to the owner and to an admin who is not a member, and shows the history', async () => {
    mockFetch({
      'GET /api/notebooks/n1/audit': {
        body: [{ id: 'e1', at: '2025-03-01T10:00:00Z', actor: { id: 'u1', displayName: 'Ilse Marenko' }, notebookId: 'n1', action: 'review.request', details: {} }],
      },
    });
    const { unmount } = renderPanel(null, 'admin');
    expect(await screen.findByRole('tab', { name: 'History' })).toBeTruthy();
    unmount();
    renderPanel('owner');
    await userEvent.click(await screen.findByRole('tab', { name: 'History' }));
    expect(await screen.findByText('Ilse Marenko asked for review')).toBeTruthy();
  });
});
