import type { CellView } from '@cribra/contracts';
import { QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../../lib/api-client';
import { createQueryClient } from '../../../lib/query-client';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { useCellDraft } from './use-cell-draft';

afterEach(() => {
  cleanup();
  resetCsrfToken();
  vi.unstubAllGlobals();
});

const cell = (revision: number, source: string, by = 'Ilse'): CellView => ({
  id: 'c1',
  notebookId: 'n1',
  kind: 'query',
  title: null,
  source,
  position: 0,
  revision,
  author: { id: 'u', displayName: by },
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-01T00:00:00Z',
  latestRun: null,
});

function wrapper({ children }: { children: ReactNode }) {
  return <QueryClientProvider client={createQueryClient()}>{children}</QueryClientProvider>;
}

describe('useCellDraft', () => {
  it('saves with the revision it started from', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) => ({ body: cell(4, (req.body as { source: string }).source) }),
    });
    const { result } = renderHook(() => useCellDraft(cell(3, 'show 1')), { wrapper });
    act(() => result.current.setDraft('show 2'));
    expect(result.current.dirty).toBe(true);
    await act(() => result.current.save());
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({ revision: 3, source: 'show 2' });
  });

  it('saves the text handed in by the editor when the draft state is behind it', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) => ({ body: cell(4, (req.body as { source: string }).source) }),
    });
    const { result } = renderHook(() => useCellDraft(cell(3, 'show 1')), { wrapper });
    await act(() => result.current.save('show 1 + 1'));
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({ revision: 3, source: 'show 1 + 1' });
  });

  it('keeps a stale save as a conflict; "keep mine" saves over the current revision', async () => {
    const theirs = cell(5, 'show 99', 'Teodor');
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) =>
        (req.body as { revision: number }).revision === 3
          ? apiError(409, 'Conflict', 'The cell changed since you loaded it.', { reason: 'stale_revision', current: theirs })
          : { body: cell(6, (req.body as { source: string }).source) },
    });
    const { result } = renderHook(() => useCellDraft(cell(3, 'show 1')), { wrapper });
    act(() => result.current.setDraft('show 2'));
    let saved: CellView | null = cell(0, '');
    await act(async () => {
      saved = await result.current.save();
    });
    expect(saved).toBeNull();
    expect(result.current.conflict?.source).toBe('show 99');
    expect(result.current.saveError).toBeNull();
    await act(() => result.current.keepMine());
    const puts = calls.filter((c) => c.method === 'PUT').map((c) => c.body);
    expect(puts).toEqual([{ revision: 3, source: 'show 2' }, { revision: 5, source: 'show 2' }]);
    await waitFor(() => expect(result.current.conflict).toBeNull());
  });

  it('"take theirs" replaces the text and tells the editor to show it', async () => {
    const theirs = cell(5, 'show 99', 'Teodor');
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': apiError(409, 'Conflict', 'stale', { reason: 'stale_revision', current: theirs }),
    });
    const { result } = renderHook(() => useCellDraft(cell(3, 'show 1')), { wrapper });
    act(() => result.current.setDraft('show 2'));
    await act(() => result.current.save());
    const key = result.current.replaceKey;
    act(() => result.current.takeTheirs());
    expect(result.current.draft).toBe('show 99');
    expect(result.current.conflict).toBeNull();
    expect(result.current.replaceKey).toBe(key + 1);
  });

  it('keeps its own base revision when a remote save arrives while the text is unsaved (no lost update)', async () => {
    const theirs = cell(4, 'show 1 + 3', 'Teodor');
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) =>
        (req.body as { revision: number }).revision === 3
          ? apiError(409, 'Conflict', 'stale', { reason: 'stale_revision', current: theirs })
          : { body: cell(5, (req.body as { source: string }).source) },
    });
    const { result, rerender } = renderHook(({ c }) => useCellDraft(c), { wrapper, initialProps: { c: cell(3, 'show 1') } });
    act(() => result.current.setDraft('show 1 + 2'));
    rerender({ c: theirs });
    expect(result.current.draft).toBe('show 1 + 2');
    expect(result.current.behind).toBe(true);
    expect(result.current.baseRevision).toBe(3);
    await act(() => result.current.save());
    expect(calls.filter((c) => c.method === 'PUT').map((c) => c.body)).toEqual([{ revision: 3, source: 'show 1 + 2' }]);
    expect(result.current.conflict?.source).toBe('show 1 + 3');
    await act(() => result.current.saveMerge('show 1 + 2 + 3'));
    expect(calls.filter((c) => c.method === 'PUT').map((c) => c.body)[1]).toEqual({ revision: 4, source: 'show 1 + 2 + 3' });
    expect(result.current.conflict).toBeNull();
    expect(result.current.draft).toBe('show 1 + 2 + 3');
    expect(result.current.dirty).toBe(false);
  });

  it('follows a remote save while nothing is unsaved, and then saves against the new revision', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PUT /api/cells/c1': (req) => ({ body: cell(5, (req.body as { source: string }).source) }),
    });
    const { result, rerender } = renderHook(({ c }) => useCellDraft(c), { wrapper, initialProps: { c: cell(3, 'show 1') } });
    const key = result.current.replaceKey;
    rerender({ c: cell(4, 'show 7', 'Teodor') });
    expect(result.current.draft).toBe('show 7');
    expect(result.current.replaceKey).toBe(key + 1);
    expect(result.current.dirty).toBe(false);
    act(() => result.current.setDraft('show 8'));
    await act(() => result.current.save());
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({ revision: 4, source: 'show 8' });
  });
});
