import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test-utils/mock-fetch';
import { renderRoutes } from '../../../test-utils/render';
import { ImportNotebookButton } from './import-notebook-button';

const file = (text: string) => new File([text], 'broken.sift', { type: 'text/plain' });

describe('ImportNotebookButton', () => {
  it('sends the file and lists every refused line', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'POST /api/notebooks/import': {
        status: 400,
        body: {
          statusCode: 400, error: 'Bad Request', message: "Line 5: unknown cell kind 'sketch'; a cell is query, claim or note",
          details: { reason: 'parse_error', errors: [
            { line: 5, message: "unknown cell kind 'sketch'; a cell is query, claim or note" },
            { line: 9, message: 'header lines (@@@) belong before the first cell' },
          ] },
        },
      },
    });
    const onImported = vi.fn();
    renderRoutes([{ path: '/', element: <ImportNotebookButton onImported={onImported} /> }], '/');
    expect(screen.getByRole('button', { name: 'New notebook from file' })).toBeTruthy();
    await userEvent.upload(screen.getByLabelText('Notebook file (.sift)'), file('@@ sketch\n'));
    expect(await screen.findByText(/Nothing was imported: Line 5/)).toBeTruthy();
    expect(screen.getByText('line 9: header lines (@@@) belong before the first cell')).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST' && c.url.endsWith('/api/notebooks/import'))).toBe(true);
    expect(onImported).not.toHaveBeenCalled();
  });
});
