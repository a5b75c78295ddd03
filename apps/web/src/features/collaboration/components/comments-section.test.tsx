import type { CommentThreadView, CommentView, NotebookView } from '@cribra/contracts';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { formatDateTime } from '../../../lib/format';
import { apiError, mockFetch, type Reply } from '../../../test-utils/mock-fetch';
import { renderWithApp } from '../../../test-utils/render';
import { CommentsSection } from './comments-section';

const ilse = { id: '11111111-1111-4111-8111-111111111111', displayName: 'Ilse Marenko' };
const teodor = { id: '22222222-2222-4222-8222-222222222222', displayName: 'Teodor Quill' };
const anneke = { id: '33333333-3333-4333-8333-333333333333', displayName: 'Anneke Voss' };
const tamsin = { id: '44444444-4444-4444-8444-444444444444', displayName: 'Tamsin Quarrie' };

const notebook = {
  id: 'n1',
  status: 'draft',
  myRole: 'owner',
  cells: [],
  members: [
    { userId: ilse.id, displayName: ilse.displayName, email: 'ilse@example.org', role: 'owner', addedAt: '2025-01-01T00:00:00Z' },
    { userId: teodor.id, displayName: teodor.displayName, email: 'teodor@example.org', role: 'editor', addedAt: '2025-01-01T00:00:00Z' },
    { userId: anneke.id, displayName: anneke.displayName, email: 'anneke@example.org', role: 'reviewer', addedAt: '2025-01-01T00:00:00Z' },
    { userId: tamsin.id, displayName: tamsin.displayName, email: 'tamsin@example.org', role: 'viewer', addedAt: '2025-01-01T00:00:00Z' },
  ],
} as unknown as NotebookView;

const comment = (over: Partial<CommentView>): CommentView => ({
  id: 'c1', threadId: 't1', author: ilse, body: 'The bound holds for $x > 10^6$.', mentions: [], createdAt: '2025-03-01T10:00:00Z', editedAt: null, ...over,
});
const mine = comment({});
const theirs = comment({ id: 'c2', author: teodor, body: 'Agreed, @Ilse Marenko.', mentions: [ilse], createdAt: '2025-03-01T11:00:00Z' });
const thread = (comments: CommentView[]): CommentThreadView => ({
  id: 't1', notebookId: 'n1', anchor: { kind: 'notebook' }, status: 'open', createdBy: ilse, createdAt: '2025-03-01T10:00:00Z', resolvedBy: null, resolvedAt: null, comments,
});

function setup(routes: Record<string, Reply | Reply[]> = {}) {
  const mocked = mockFetch({
    'GET /api/auth/me': { body: { ...ilse, email: 'ilse@example.org', siteRole: 'member', createdAt: '2025-01-01T00:00:00Z' } },
    'GET /api/auth/csrf': { body: { token: 't' } },
    'GET /api/notebooks/n1/threads': { body: [thread([mine, theirs])] },
    ...routes,
  });
  renderWithApp(<CommentsSection notebook={notebook} canWrite />);
  return mocked;
}

const commentBy = (name: string) => screen.findByRole('region', { name: `Comment by ${name}` });

describe('CommentsSection: editing one\'s own comments', () => {
  it('offers Edit on the reader\'s own comment only', async () => {
    setup();
    expect(await within(await commentBy('Ilse Marenko')).findByRole('button', { name: 'Edit' })).toBeTruthy();
    expect(within(await commentBy('Teodor Quill')).queryByRole('button', { name: 'Edit' })).toBeNull();
    expect(screen.getAllByRole('button', { name: 'Edit' })).toHaveLength(1);
  });

  it('sends the edit as a PATCH, then shows the new text and when it was edited', async () => {
    const edited = comment({ body: 'The bound holds for all x past ten million.', editedAt: '2025-03-02T09:30:00Z' });
    const { calls } = setup({
      'GET /api/notebooks/n1/threads': [{ body: [thread([mine, theirs])] }, { body: [thread([edited, theirs])] }],
      'PATCH /api/comments/c1': { body: edited },
    });
    await userEvent.click(await within(await commentBy('Ilse Marenko')).findByRole('button', { name: 'Edit' }));
    const box = screen.getByLabelText('Edit comment', { selector: 'textarea' });
    expect((box as HTMLTextAreaElement).value).toBe(mine.body);
    await userEvent.clear(box);
    await userEvent.type(box, 'The bound holds for all x past ten million.');
    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    await waitFor(() => expect(screen.queryByRole('button', { name: 'Save' })).toBeNull());
    const patch = calls.find((c) => c.method === 'PATCH');
    expect(patch?.url).toBe('/api/comments/c1');
    expect(patch?.body).toEqual({ body: 'The bound holds for all x past ten million.', mentions: [] });
    const region = await commentBy('Ilse Marenko');
    expect(await within(region).findByText('The bound holds for all x past ten million.')).toBeTruthy();
    expect(within(region).getByText(/edited/).textContent).toContain(`edited ${formatDateTime(edited.editedAt!)}`);
  });

  it('keeps the typed text and shows the API\'s message when the edit is refused', async () => {
    const { calls } = setup({
      'PATCH /api/comments/c1': [
        apiError(400, 'Bad Request', 'Validation failed', [{ field: 'body', messages: ['body must be at most 20000 characters'] }]),
        apiError(403, 'Forbidden', 'Only its author can edit a comment'),
      ],
    });
    await userEvent.click(await within(await commentBy('Ilse Marenko')).findByRole('button', { name: 'Edit' }));
    const box = screen.getByLabelText('Edit comment', { selector: 'textarea' }) as HTMLTextAreaElement;
    await userEvent.type(box, ' Checked twice.');
    await userEvent.click(screen.getByRole('button', { name: 'Save' }));

    expect(await screen.findByText('body must be at most 20000 characters')).toBeTruthy();
    expect(box.value).toBe(`${mine.body} Checked twice.`);
    expect(screen.getByRole('button', { name: 'Save' })).toBeTruthy();

    await userEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText('Only its author can edit a comment')).toBeTruthy();
    expect((screen.getByLabelText('Edit comment', { selector: 'textarea' }) as HTMLTextAreaElement).value).toBe(`${mine.body} Checked twice.`);
    expect(calls.filter((c) => c.method === 'PATCH')).toHaveLength(2);
  });
});

describe('CommentsSection: mentions', () => {
  it('offers members for "@te", and sends the picked one as a user id with "@Name" in the text', async () => {
    const { calls } = setup({ 'POST /api/notebooks/n1/threads': { status: 201, body: thread([]) } });
    const box = await screen.findByLabelText('Comment', { selector: 'textarea' });
    await userEvent.type(box, 'Could you check the sieve, @te');
    const list = screen.getByRole('listbox', { name: 'Members to mention' });
    expect(within(list).getAllByRole('option').map((o) => o.textContent)).toEqual(['Teodor Quill']);
    await userEvent.keyboard('{Enter}');
    expect(screen.queryByRole('listbox')).toBeNull();
    await userEvent.type(box, 'please?');
    await userEvent.click(screen.getByRole('button', { name: 'Start thread' }));

    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.url === '/api/notebooks/n1/threads')).toBe(true));
    expect(calls.find((c) => c.url === '/api/notebooks/n1/threads' && c.method === 'POST')?.body).toEqual({
      anchor: { kind: 'notebook' },
      body: 'Could you check the sieve, @Teodor Quill please?',
      mentions: [teodor.id],
    });
  });

  it('moves through the list with the arrow keys, closes it with Escape, and picks with the mouse in a reply', async () => {
    const { calls } = setup({ 'POST /api/threads/t1/comments': { status: 201, body: comment({ id: 'c3' }) } });
    const reply = await screen.findByLabelText('Reply', { selector: 'textarea' });
    await userEvent.type(reply, '@i');
    // "i" matches Ilse; nobody else has a name or word starting with it.
    expect(screen.getAllByRole('option').map((o) => o.textContent)).toEqual(['Ilse Marenko']);
    await userEvent.clear(reply);
    await userEvent.type(reply, 'Thanks @a');
    expect(screen.getAllByRole('option').map((o) => o.textContent)).toEqual(['Anneke Voss']);
    await userEvent.type(reply, '{Backspace}{Backspace}');
    expect(screen.queryByRole('listbox')).toBeNull();
    await userEvent.type(reply, '@q');
    const selected = () => screen.getAllByRole('option').filter((o) => o.getAttribute('aria-selected') === 'true').map((o) => o.textContent);
    expect(screen.getAllByRole('option').map((o) => o.textContent)).toEqual(['Teodor Quill', 'Tamsin Quarrie']);
    expect(selected()).toEqual(['Teodor Quill']);
    await userEvent.keyboard('{ArrowDown}');
    expect(selected()).toEqual(['Tamsin Quarrie']);
    await userEvent.keyboard('{ArrowDown}');
    expect(selected()).toEqual(['Teodor Quill']);
    await userEvent.keyboard('{ArrowUp}');
    expect(selected()).toEqual(['Tamsin Quarrie']);
    await userEvent.keyboard('{Escape}');
    expect(screen.queryByRole('listbox')).toBeNull();
    await userEvent.type(reply, 'u');
    await userEvent.click(screen.getByRole('option', { name: 'Teodor Quill' }));
    await userEvent.click(screen.getByRole('button', { name: 'Send' }));

    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ body: 'Thanks @Teodor Quill', mentions: [teodor.id] });
  });

  it('sends no mention when the "@Name" was deleted from the text again', async () => {
    const { calls } = setup({ 'POST /api/notebooks/n1/threads': { status: 201, body: thread([]) } });
    const box = await screen.findByLabelText('Comment', { selector: 'textarea' });
    await userEvent.type(box, '@an');
    await userEvent.keyboard('{Enter}');
    await userEvent.clear(box);
    await userEvent.type(box, 'No one in particular.');
    await userEvent.click(screen.getByRole('button', { name: 'Start thread' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toMatchObject({ body: 'No one in particular.', mentions: [] });
  });

  it('clears each reply box once its own reply is accepted, also when two are under way at once', async () => {
    let release = (): void => undefined;
    const held = new Promise<void>((resolve) => (release = resolve));
    const second: CommentThreadView = { ...thread([]), id: 't2' };
    setup({
      'GET /api/notebooks/n1/threads': { body: [thread([mine]), second] },
      'POST /api/threads/t1/comments': { status: 201, body: comment({ id: 'c9' }), after: held },
      'POST /api/threads/t2/comments': { status: 201, body: comment({ id: 'c8', threadId: 't2' }) },
    });
    const [first, other] = await screen.findAllByLabelText('Reply', { selector: 'textarea' });
    await userEvent.type(first!, 'First reply');
    await userEvent.type(other!, 'Second reply');
    const [sendFirst, sendOther] = screen.getAllByRole('button', { name: 'Send' });
    await userEvent.click(sendFirst!);
    await userEvent.click(sendOther!);
    await waitFor(() => expect((other as HTMLTextAreaElement).value).toBe(''));
    expect((first as HTMLTextAreaElement).value).toBe('First reply');
    release();
    await waitFor(() => expect((first as HTMLTextAreaElement).value).toBe(''));
  });

  it('starts a thread on one output of a cell\'s latest run', async () => {
    const cell = { id: 'cell-1', kind: 'query', latestRun: { id: 'run-9', outputs: [{ kind: 'value' }, { kind: 'table' }] } };
    const mocked = mockFetch({
      'GET /api/auth/me': { body: { ...ilse, email: 'ilse@example.org', siteRole: 'member', createdAt: '2025-01-01T00:00:00Z' } },
      'GET /api/auth/csrf': { body: { token: 't' } },
      'GET /api/notebooks/n1/threads': { body: [] },
      'POST /api/notebooks/n1/threads': { status: 201, body: thread([]) },
    });
    renderWithApp(<CommentsSection notebook={{ ...notebook, cells: [cell] } as unknown as NotebookView} canWrite />);
    await userEvent.click(await screen.findByRole('combobox', { name: 'About' }));
    expect(screen.getAllByRole('option').map((o) => o.textContent)).toEqual([
      'The whole notebook', 'Cell 1 (query)', 'Cell 1, output 1 (value)', 'Cell 1, output 2 (table)',
    ]);
    await userEvent.click(screen.getByRole('option', { name: 'Cell 1, output 2 (table)' }));
    await userEvent.type(screen.getByLabelText('Comment', { selector: 'textarea' }), 'Row 3 disagrees with the closed form.');
    await userEvent.click(screen.getByRole('button', { name: 'Start thread' }));
    await waitFor(() => expect(mocked.calls.some((c) => c.method === 'POST')).toBe(true));
    expect(mocked.calls.find((c) => c.method === 'POST')?.body).toMatchObject({
      anchor: { kind: 'output', cellId: 'cell-1', runId: 'run-9', outputIndex: 1 },
      body: 'Row 3 disagrees with the closed form.',
    });
  });

  it('highlights the mentioned names in shown comments', async () => {
    setup();
    const region = await commentBy('Teodor Quill');
    await waitFor(() => expect(region.querySelector('.mention')?.textContent).toBe('@Ilse Marenko'));
    expect((await commentBy('Ilse Marenko')).querySelector('.mention')).toBeNull();
  });
});
