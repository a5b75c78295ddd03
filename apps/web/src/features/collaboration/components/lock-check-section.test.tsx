import type { VerificationCellResult, VerificationView } from '@cribra/contracts';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { apiError, mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { LockCheckSection } from './lock-check-section';

const cell = (position: number, status: VerificationCellResult['status'], over: Partial<VerificationCellResult> = {}): VerificationCellResult => ({
  cellId: `c${position}`,
  position,
  kind: 'query',
  status,
  recordedDigest: 'a'.repeat(64),
  newDigest: status === 'same' ? 'a'.repeat(64) : null,
  note: null,
  recordedOutputs: null,
  newOutputs: null,
  runId: `r${position}`,
  error: null,
  ...over,
});

const check = (status: VerificationView['status'], cells: VerificationCellResult[]): VerificationView => {
  const counts = { pending: 0, same: 0, differs: 0, failed: 0, skipped: 0 };
  for (const c of cells) counts[c.status] += 1;
  return {
    id: 'v1',
    notebookId: 'n1',
    purpose: 'lock',
    status,
    revisionDigest: 'd'.repeat(64),
    requestedBy: { id: 'u1', displayName: 'Ilse Marenko' },
    createdAt: '2025-03-01T10:00:00Z',
    finishedAt: status === 'done' ? '2025-03-01T10:01:00Z' : null,
    counts,
    allSame: status === 'done' && counts.differs === 0 && counts.failed === 0 && counts.pending === 0,
    engineVersion: null,
    languageVersion: null,
    cells,
  };
};

const running = check('running', [cell(0, 'pending'), cell(1, 'pending'), cell(2, 'pending')]);
const done = check('done', [
  cell(0, 'same'),
  cell(1, 'differs', { newDigest: 'b'.repeat(64), note: 'outputs differ', recordedOutputs: [], newOutputs: [] }),
  cell(2, 'failed', { note: 'the re-run failed', error: { message: 'time limit of 60 s reached' } as VerificationCellResult['error'] }),
]);

describe('LockCheckSection', () => {
  it('queues a re-check, keeps the button disabled while it runs, then shows same, differs and failed per cell', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/notebooks/n1/lock/checks': { status: 202, body: running },
      'GET /api/verifications/v1': [{ body: running }, { body: done }],
    });
    renderWithApp(<LockCheckSection notebookId="n1" />);
    await userEvent.click(screen.getByRole('button', { name: 'Re-check the record' }));
    expect(await screen.findByRole('progressbar', { name: 'Re-checking' })).toBeTruthy();
    expect(screen.getByText('0 of 3 cells compared so far…')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Re-check the record' }) as HTMLButtonElement).disabled).toBe(true);

    const table = await screen.findByRole('table', { name: 'Cells re-checked' }, { timeout: 1000 });
    await waitFor(() => expect(screen.queryByRole('progressbar', { name: 'Re-checking' })).toBeNull(), { timeout: 4000 });
    const rows = within(table).getAllByRole('row').slice(1).map((r) => r.textContent ?? '');
    expect(rows[0]).toMatch(/^1 query\s*same/);
    expect(rows[1]).toMatch(/^2 query\s*differs\s*outputs differ/);
    expect(rows.find((r) => r.startsWith('3 query'))).toMatch(/failed.*the re-run failed.*time limit of 60 s reached/);
    expect(screen.getByText(/1 same, 1 differ, 1 failed: the re-run does not match the lock record\./)).toBeTruthy();
    expect(screen.getByText(/Computed evidence is not a proof\./)).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Re-check the record' }) as HTMLButtonElement).disabled).toBe(false);
    expect(calls.filter((c) => c.method === 'POST' && c.url === '/api/notebooks/n1/lock/checks')).toHaveLength(1);
  });

  it.each([
    [403, 'Forbidden', 'You are not a member of this notebook'],
    [409, 'Conflict', 'A check of this notebook is already running'],
  ])('shows the API message of a %i refusal', async (status, error, message) => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/notebooks/n1/lock/checks': apiError(status, error, message),
    });
    renderWithApp(<LockCheckSection notebookId="n1" />);
    await userEvent.click(screen.getByRole('button', { name: 'Re-check the record' }));
    expect((await screen.findByRole('alert')).textContent).toContain(message);
    expect((screen.getByRole('button', { name: 'Re-check the record' }) as HTMLButtonElement).disabled).toBe(false);
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('shows the latest earlier re-check when the page opens, following one still running (e.g. after a reload)', async () => {
    const { cells: _cells, ...listed } = running; // a summary: the view without its cells
    void _cells;
    mockFetch({
      'GET /api/notebooks/n1/verifications': {
        body: [
          { ...listed, id: 'v0', purpose: 'review' },
          { ...listed }, // the lock check v1, newest of its kind
        ],
      },
      'GET /api/verifications/v1': [{ body: running }, { body: done }],
    });
    renderWithApp(<LockCheckSection notebookId="n1" />);
    expect(await screen.findByText(/Last re-check, started .* by Ilse Marenko/)).toBeTruthy();
    // Still running: the button waits, then the results of that same check appear.
    expect((screen.getByRole('button', { name: 'Re-check the record' }) as HTMLButtonElement).disabled).toBe(true);
    expect(await screen.findByText(/time limit of 60 s reached/, {}, { timeout: 4000 })).toBeTruthy();
    await waitFor(() => expect((screen.getByRole('button', { name: 'Re-check the record' }) as HTMLButtonElement).disabled).toBe(false));
  });

  it('shows no earlier result when the notebook has only review re-verifications', async () => {
    const { cells: _cells, ...listed } = running;
    void _cells;
    const { calls } = mockFetch({ 'GET /api/notebooks/n1/verifications': { body: [{ ...listed, id: 'v0', purpose: 'review' }] } });
    renderWithApp(<LockCheckSection notebookId="n1" />);
    await waitFor(() => expect(calls.some((c) => c.url.includes('/notebooks/n1/verifications'))).toBe(true));
    expect(screen.queryByText(/Last re-check/)).toBeNull();
    expect(calls.some((c) => c.url.includes('/api/verifications/'))).toBe(false);
  });
});
