import type { MemberRole, NotebookStatus, NotebookView, SiteRole } from '@cribra/contracts';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import { notebookKeys } from '../api/keys';
import NotebookPage from './notebook-page';

const notebook = (myRole: MemberRole | null, status: NotebookStatus): NotebookView => ({
  id: 'n1',
  title: 'Sixes in the wheel',
  summary: 'Counting gaps 6 level by level.',
  tags: ['wheel'],
  status,
  revision: 7,
  requiredSignoffs: 2,
  owner: { id: 'u1', displayName: 'Ilse Marenko' },
  myRole,
  cellCount: 0,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-02T00:00:00Z',
  cells: [],
  members: [],
});

async function openPage(myRole: MemberRole | null, status: NotebookStatus, siteRole: SiteRole = 'member') {
  mockFetch({
    'GET /api/auth/me': { body: { id: 'u2', email: 'a@example.org', displayName: 'Teodor', siteRole, createdAt: '2026-01-01T00:00:00Z' } },
    'GET /api/notebooks/n1': { body: notebook(myRole, status) },
  });
  renderRoutes([{ path: '/notebooks/:id', element: <NotebookPage /> }], '/notebooks/n1');
  await screen.findByRole('heading', { name: 'Sixes in the wheel' });
}

const settingsButton = () => screen.queryByRole('button', { name: 'Settings' });

describe('NotebookPage settings', () => {
  it('offers the settings to an owner of a draft and opens them filled in, with the sign-offs in the caption', async () => {
    await openPage('owner', 'draft');
    expect(screen.getByText(/2 sign-offs required/)).toBeTruthy();
    await userEvent.click(settingsButton()!);
    const dialog = await screen.findByRole('dialog', { name: 'Notebook settings' });
    expect(dialog).toBeTruthy();
    expect((screen.getByLabelText(/^Title/) as HTMLInputElement).value).toBe('Sixes in the wheel');
    expect((screen.getByLabelText(/^Required sign-offs/) as HTMLInputElement).value).toBe('2');
  });

  it('offers them to an editor of a notebook in review', async () => {
    await openPage('editor', 'in_review');
    expect(settingsButton()).not.toBeNull();
  });

  it('offers them to an admin who is not a member', async () => {
    await openPage(null, 'draft', 'admin');
    expect(await screen.findByRole('button', { name: 'Settings' })).toBeTruthy();
  });

  it.each<MemberRole>(['viewer', 'reviewer'])('hides them from a %s', async (role) => {
    await openPage(role, 'draft');
    expect(settingsButton()).toBeNull();
  });

  it('hides them on a locked notebook, even from its owner', async () => {
    await openPage('owner', 'locked');
    expect(settingsButton()).toBeNull();
  });
});

describe('NotebookPage when a refresh fails', () => {
  it('keeps the loaded notebook and an open dialog, and says the refresh failed', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { id: 'u1', email: 'a@example.org', displayName: 'Ilse', siteRole: 'member', createdAt: '2026-01-01T00:00:00Z' } },
      // First load answers; every later read is refused (e.g. access withdrawn meanwhile).
      'GET /api/notebooks/n1': [{ body: notebook('owner', 'draft') }, { status: 403, body: { statusCode: 403, error: 'Forbidden', message: 'You are no longer a member of this notebook' } }],
    });
    const { queryClient } = renderRoutes([{ path: '/notebooks/:id', element: <NotebookPage /> }], '/notebooks/n1');
    await screen.findByRole('heading', { name: 'Sixes in the wheel' });
    await userEvent.click(settingsButton()!);
    await userEvent.type(screen.getByLabelText(/^Title/), ' and eights');
    await queryClient.refetchQueries({ queryKey: notebookKeys.detail('n1') });
    expect(await screen.findByText(/Could not refresh the notebook \(You are no longer a member of this notebook\)/)).toBeTruthy();
    // The page behind the dialog is still the notebook (hidden from the accessibility tree by the open dialog).
    await waitFor(() => expect(screen.getByRole('heading', { name: 'Sixes in the wheel', hidden: true })).toBeTruthy());
    expect((screen.getByLabelText(/^Title/) as HTMLInputElement).value).toBe('Sixes in the wheel and eights');
  });

  it('shows the error screen when the notebook never loaded', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { id: 'u1', email: 'a@example.org', displayName: 'Ilse', siteRole: 'member', createdAt: '2026-01-01T00:00:00Z' } },
      'GET /api/notebooks/n1': { status: 403, body: { statusCode: 403, error: 'Forbidden', message: 'Not a member' } },
    });
    renderRoutes([{ path: '/notebooks/:id', element: <NotebookPage /> }], '/notebooks/n1');
    expect(await screen.findByText(/Could not open this notebook/)).toBeTruthy();
  });
});
