import { CSRF_HEADER } from '@cribra/contracts';
import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { apiError } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { UploadsSection } from './uploads-section';

describe('UploadsSection', () => {
  it('uploads a chosen file as form data with the CSRF token and lists the refusals by line', async () => {
    const seen: Array<{ body: unknown; headers: Record<string, string> }> = [];
    vi.stubGlobal('fetch', vi.fn(async (url: string, init: RequestInit = {}) => {
      const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
      if (url === '/api/auth/csrf') return json(200, { token: 'tok' });
      if (url === '/api/notebooks/n1/uploads' && init.method === 'POST') {
        seen.push({ body: init.body, headers: init.headers as Record<string, string> });
        const refusal = apiError(400, 'Bad Request', 'The file was refused', {
          reason: 'parse_error',
          errors: [{ line: 4, message: '"x7" is not an integer' }, { line: 7, message: '"1.5" is not an integer' }],
        });
        return json(400, refusal.body);
      }
      return json(200, []);
    }));
    const { container } = renderWithApp(<UploadsSection notebookId="n1" canEdit />);
    await screen.findByText('No files yet.');
    const input = container.querySelector('input[type=file]') as HTMLInputElement;
    fireEvent.change(input, { target: { files: [new File(['0\n2\n6\nx7\n'], 'h.txt', { type: 'text/plain' })] } });
    const list = await screen.findByRole('list', { name: 'Problems by line' });
    expect(list.textContent).toContain('line 4: "x7" is not an integer');
    expect(list.textContent).toContain('line 7: "1.5" is not an integer');
    await waitFor(() => expect(seen).toHaveLength(1));
    expect(seen[0].body).toBeInstanceOf(FormData);
    expect((seen[0].body as FormData).get('file')).toBeInstanceOf(File);
    expect(seen[0].headers[CSRF_HEADER]).toBe('tok');
    expect(seen[0].headers['content-type']).toBeUndefined();
  });

  it('refuses a file over the size limit before sending it', async () => {
    const fetchSpy = vi.fn(async (_url: string, _init?: RequestInit) => new Response('[]', { status: 200, headers: { 'content-type': 'application/json' } }));
    vi.stubGlobal('fetch', fetchSpy);
    const { container } = renderWithApp(<UploadsSection notebookId="n1" canEdit />);
    await screen.findByText('No files yet.');
    const big = new File([new Uint8Array(3 * 1024 * 1024)], 'big.csv');
    fireEvent.change(container.querySelector('input[type=file]')!, { target: { files: [big] } });
    expect(await screen.findByText(/at most 2048 KiB are accepted/)).toBeTruthy();
    expect(fetchSpy.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });
});
