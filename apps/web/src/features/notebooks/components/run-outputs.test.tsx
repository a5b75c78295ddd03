import type { RunView } from '@cribra/contracts';
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { RunOutputs } from './run-outputs';

const value = (text: string) => ({ kind: 'value', label: 'primorial', value: { t: 'int', v: text }, text });
const run = (over: Partial<RunView> = {}): RunView => ({
  id: 'run-1',
  notebookId: 'n1',
  cellId: 'c1',
  cellRevision: 1,
  purpose: 'run',
  status: 'succeeded',
  progress: 1,
  progressNote: null,
  outputs: [value('30030')],
  outputDigest: 'd'.repeat(64),
  engineVersion: '1.0.0',
  languageVersion: '1.0.0',
  runnerId: 'r1',
  attempts: 1,
  requestedBy: { id: 'u1', displayName: 'Ilse Marenko' },
  queuedAt: '2026-01-01T00:00:00Z',
  startedAt: '2026-01-01T00:00:00Z',
  finishedAt: '2026-01-01T00:00:01Z',
  durationMs: 5,
  error: null,
  ...over,
});

const failed = (error: RunView['error']) => ({ id: '00000000-0000-4000-8000-000000000001', status: 'failed', error, outputs: [] }) as unknown as RunView;

describe('RunOutputs', () => {
  it('introduces an error from a builtin by its kind, like every other error', () => {
    renderWithApp(<RunOutputs run={failed({ kind: 'domain', message: 'primebefore: there is no prime below 2', line: 1, column: 1 })} />);
    expect(screen.getByRole('alert').textContent).toBe('Domain error (line 1, column 1): primebefore: there is no prime below 2');
  });

  it('names an unknown kind instead of leaving the title blank', () => {
    renderWithApp(<RunOutputs run={failed({ kind: 'weird' as never, message: 'x' })} />);
    expect(screen.getByRole('alert').textContent).toBe('Error (weird): x');
  });

  it('shows the outputs the notebook read carried, without asking again', async () => {
    const { calls } = mockFetch({});
    renderWithApp(<RunOutputs run={run()} />);
    expect(await screen.findByText(/30\s?030/)).toBeTruthy();
    expect(calls.filter((c) => c.url.includes('/api/runs/'))).toHaveLength(0);
  });

  it('fetches outputs the notebook read left out (a heavy run) from that run alone', async () => {
    // 13# = 30030 (OEIS A002110)
    const { calls } = mockFetch({ 'GET /api/runs/run-1': { body: run({ outputs: [value('30030')] }) } });
    renderWithApp(<RunOutputs run={run({ outputs: null, outputsOmitted: true })} />);
    expect(await screen.findByText(/30\s?030/)).toBeTruthy();
    expect(calls.filter((c) => c.method === 'GET' && c.url.startsWith('/api/runs/run-1'))).toHaveLength(1);
  });
});
