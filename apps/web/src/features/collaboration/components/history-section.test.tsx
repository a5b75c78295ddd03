import type { AuditEventView, NotebookView } from '@cribra/contracts';
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { HISTORY_PAGE, HistorySection } from './history-section';

const ilse = { id: 'u-ilse', displayName: 'Ilse Marenko' };
const notebook = {
  id: 'n1',
  myRole: 'owner',
  members: [
    { userId: 'u-ilse', displayName: 'Ilse Marenko', email: 'ilse@example.org', role: 'owner', addedAt: '2025-01-01T00:00:00Z' },
    { userId: 'u-tomas', displayName: 'Tomas Reid', email: 'tomas@example.org', role: 'reviewer', addedAt: '2025-01-01T00:00:00Z' },
  ],
} as unknown as NotebookView;

const event = (id: string, at: string, action: string, details: Record<string, unknown> = {}, actor: AuditEventView['actor'] = ilse): AuditEventView => ({
  id,
  at,
  actor,
  notebookId: 'n1',
  action,
  details,
});

describe('HistorySection', () => {
  it('lists what happened as sentences, newest first', async () => {
    mockFetch({
      'GET /api/notebooks/n1/audit': {
        body: [
          event('e3', '2025-03-03T10:00:00Z', 'review.signoff', { revisionDigest: '3f9a1c2e7b0d'.padEnd(64, '0') }, { id: 'u-tomas', displayName: 'Tomas Reid' }),
          event('e1', '2025-03-01T10:00:00Z', 'notebook.create', { title: 'Twin primes' }),
          event('e2', '2025-03-02T10:00:00Z', 'member.add', { userId: 'u-tomas', role: 'reviewer' }),
          event('e4', '2025-03-04T10:00:00Z', 'review.signoff_void', { reviewerId: 'u-tomas', revisionDigest: 'abcdef012345'.padEnd(64, '0') }, null),
        ],
      },
    });
    renderWithApp(<HistorySection notebook={notebook} />);
    const list = await screen.findByRole('list', { name: 'Notebook history' });
    const items = within(list).getAllByRole('listitem').map((li) => li.textContent ?? '');
    expect(items).toHaveLength(4);
    expect(items[0]).toContain('The sign-off by Tomas Reid no longer counts: the notebook changed (now at digest abcdef012345)');
    expect(items[1]).toContain('Tomas Reid signed off the revision with digest 3f9a1c2e7b0d');
    expect(items[2]).toContain('Ilse Marenko added Tomas Reid as reviewer');
    expect(items[3]).toContain('Ilse Marenko created the notebook');
  });

  it('shows the first events and the older ones on request', async () => {
    const total = HISTORY_PAGE + 5;
    const events = Array.from({ length: total }, (_, i) =>
      event(`e${i}`, new Date(Date.UTC(2025, 0, 1, 0, total - i)).toISOString(), 'cell.create', { kind: i === total - 1 ? 'claim' : 'query' }),
    );
    mockFetch({ 'GET /api/notebooks/n1/audit': { body: events } });
    renderWithApp(<HistorySection notebook={notebook} />);
    const list = await screen.findByRole('list', { name: 'Notebook history' });
    expect(within(list).getAllByRole('listitem')).toHaveLength(HISTORY_PAGE);
    expect(screen.queryByText('Ilse Marenko added a claim cell')).toBeNull();
    await userEvent.click(screen.getByRole('button', { name: /Show older events \(5 more\)/ }));
    expect(within(list).getAllByRole('listitem')).toHaveLength(total);
    expect(screen.getByText('Ilse Marenko added a claim cell')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Show older events/ })).toBeNull();
  });

  it('says when nothing is recorded, and shows the API refusal', async () => {
    mockFetch({ 'GET /api/notebooks/n1/audit': { body: [] } });
    const { unmount } = renderWithApp(<HistorySection notebook={notebook} />);
    expect(await screen.findByText('Nothing has been recorded for this notebook yet.')).toBeTruthy();
    unmount();
    mockFetch({ 'GET /api/notebooks/n1/audit': apiError(403, 'Forbidden', 'Only the owner and admins may read the history') });
    renderWithApp(<HistorySection notebook={notebook} />);
    expect(await screen.findByText(/Only the owner and admins may read the history/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});
