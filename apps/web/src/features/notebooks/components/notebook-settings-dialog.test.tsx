import type { NotebookSummary, NotebookView } from '@cribra/contracts';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { apiError, mockFetch, type RecordedCall } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { NotebookSettingsDialog } from './notebook-settings-dialog';

const summary = (over: Partial<NotebookSummary> = {}): NotebookSummary => ({
  id: 'n1',
  title: 'Sixes in the wheel',
  summary: 'Counting gaps 6 level by level.',
  tags: ['wheel'],
  status: 'draft',
  revision: 7,
  requiredSignoffs: 1,
  owner: { id: 'u1', displayName: 'Ilse Marenko' },
  myRole: 'owner',
  cellCount: 0,
  createdAt: '2026-01-01T00:00:00Z',
  updatedAt: '2026-01-02T00:00:00Z',
  ...over,
});
const view = (over: Partial<NotebookSummary> = {}): NotebookView => ({ ...summary(over), cells: [], members: [] });

const patches = (calls: RecordedCall[]) => calls.filter((c) => c.method === 'PATCH').map((c) => c.body);

function open(nb = summary()) {
  const onClose = vi.fn();
  renderWithApp(<NotebookSettingsDialog notebook={nb} onClose={onClose} />);
  return { onClose };
}

async function replace(label: RegExp, text: string) {
  const input = screen.getByLabelText(label);
  await userEvent.clear(input); // leaves the focus in the field
  if (text) await userEvent.paste(text);
}

describe('NotebookSettingsDialog', () => {
  it('sends the changed fields with the revision it opened at, then closes', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PATCH /api/notebooks/n1': { body: view({ revision: 8, title: 'Sixes and eights' }) },
    });
    const { onClose } = open();
    await replace(/^Title/, 'Sixes and eights');
    await replace(/^Tags/, 'Wheel, gap-patterns  c++');
    await replace(/^Required sign-offs/, '2');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    // The summary was left alone, so it is not sent; tags are split, trimmed and lower-cased.
    expect(patches(calls)).toEqual([
      { revision: 7, title: 'Sixes and eights', tags: ['wheel', 'gap-patterns', 'c++'], requiredSignoffs: 2 },
    ]);
  });

  it('refuses an empty title, a bad tag and an out-of-range sign-off count before asking the API', async () => {
    const { calls } = mockFetch({ 'GET /api/auth/csrf': { body: { token: 't' } } });
    const { onClose } = open();
    await replace(/^Title/, '   ');
    await replace(/^Tags/, 'wheel, (mod 6)');
    await replace(/^Required sign-offs/, '0');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(screen.getByText('Give the notebook a title.')).toBeTruthy();
    expect(screen.getByText(/Tag “\(mod” is not allowed/)).toBeTruthy();
    expect(screen.getByText('Enter a whole number from 1 to 20.')).toBeTruthy();
    expect(patches(calls)).toEqual([]);
    expect(onClose).not.toHaveBeenCalled();
  });

  it("shows the API's 400 field message next to its field and keeps the dialog open", async () => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PATCH /api/notebooks/n1': apiError(400, 'Bad Request', 'tags use letters, digits and # + . _ -', [
        { field: 'tags', messages: ['tags use letters, digits and # + . _ -'] },
      ]),
    });
    const { onClose } = open();
    await replace(/^Tags/, 'wheel, sieve');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const message = await screen.findByText('tags use letters, digits and # + . _ -');
    expect(screen.getByLabelText(/^Tags/).getAttribute('aria-describedby')).toBe(message.id);
    expect(screen.getByLabelText(/^Tags/).getAttribute('aria-invalid')).toBe('true');
    expect(onClose).not.toHaveBeenCalled();
  });

  it('on a stale revision keeps the input, names the current title, and applies the input onto the current revision', async () => {
    const theirs = summary({ revision: 9, title: 'Sixes, revisited' });
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'GET /api/notebooks/n1': { body: view({ revision: 9, title: 'Sixes, revisited' }) },
      'PATCH /api/notebooks/n1': (req) =>
        (req.body as { revision: number }).revision === 7
          ? apiError(409, 'Conflict', 'The notebook changed since revision 7', { reason: 'stale_revision', current: theirs })
          : { body: view({ revision: 10, summary: 'Gaps of 6 only.' }) },
    });
    const { onClose } = open();
    await replace(/^Summary/, 'Gaps of 6 only.');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toMatch(/Someone else changed this notebook/);
    expect(alert.textContent).toContain('“Sixes, revisited”');
    expect((screen.getByLabelText(/^Summary/) as HTMLTextAreaElement).value).toBe('Gaps of 6 only.');
    expect(onClose).not.toHaveBeenCalled();

    await userEvent.click(screen.getByRole('button', { name: 'Apply my changes to revision 9' }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(patches(calls)).toEqual([
      { revision: 7, summary: 'Gaps of 6 only.' },
      { revision: 9, summary: 'Gaps of 6 only.' },
    ]);
  });

  it('applies the changes onto the current revision without asking when only cells changed meanwhile', async () => {
    const { calls } = mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PATCH /api/notebooks/n1': (req) =>
        (req.body as { revision: number }).revision === 7
          ? apiError(409, 'Conflict', 'The notebook changed since revision 7', { reason: 'stale_revision', current: summary({ revision: 12, cellCount: 3 }) })
          : { body: view({ revision: 13, summary: 'Gaps of 6 only.' }) },
    });
    const { onClose } = open();
    await replace(/^Summary/, 'Gaps of 6 only.');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(screen.queryByRole('alert')).toBeNull();
    expect(patches(calls)).toEqual([
      { revision: 7, summary: 'Gaps of 6 only.' },
      { revision: 12, summary: 'Gaps of 6 only.' },
    ]);
  });

  it('says so when the notebook was locked meanwhile, keeps the input and offers no retry', async () => {
    mockFetch({
      'GET /api/auth/csrf': { body: { token: 't' } },
      'PATCH /api/notebooks/n1': apiError(409, 'Conflict', 'This notebook is locked', { reason: 'notebook_locked', notebookId: 'n1' }),
    });
    open();
    await replace(/^Title/, 'Sixes, final');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect((await screen.findByRole('alert')).textContent).toMatch(/was locked while you were editing/);
    expect((screen.getByLabelText(/^Title/) as HTMLInputElement).value).toBe('Sixes, final');
    expect(screen.getByRole('button', { name: 'Save settings' }).hasAttribute('disabled')).toBe(true);
    expect(screen.queryByRole('button', { name: /Apply my changes/ })).toBeNull();
  });

  it('disables saving while the request is on its way', async () => {
    let answer: (r: Response) => void = () => undefined;
    const { calls } = mockFetch({ 'GET /api/auth/csrf': { body: { token: 't' } } });
    const fetchMock = vi.mocked(fetch);
    const routed = fetchMock.getMockImplementation()!;
    fetchMock.mockImplementation(async (input, init) => {
      if ((init?.method ?? 'GET') !== 'PATCH') return routed(input, init);
      calls.push({ method: 'PATCH', url: String(input), headers: {}, body: JSON.parse(String(init!.body)) });
      return new Promise<Response>((resolve) => (answer = resolve));
    });
    const { onClose } = open();
    await replace(/^Title/, 'Sixes again');
    await userEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const saving = await screen.findByRole('button', { name: 'Saving…' });
    expect(saving.hasAttribute('disabled')).toBe(true);
    answer(new Response(JSON.stringify(view({ revision: 8, title: 'Sixes again' })), { status: 200, headers: { 'content-type': 'application/json' } }));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(patches(calls)).toHaveLength(1);
  });
});
