// Comment threads on a notebook, a cell and one output; Markdown with math stored as written;
// edit your own; resolve and reopen; @mentions told by e-mail.
import type { INestApplication } from '@nestjs/common';
import type { CommentThreadView, NotebookView } from '@cribra/contracts';
import { mailsTo, waitForMail } from './helpers/mailbox';
import { createNotebook, deleteNotebooks, expectStatus, memberWithRole, runAll, sleep } from './helpers/review-fixtures';
import { Client, createTestApp, newMember } from './helpers/test-app';

let app: INestApplication;
let owner: Client;
let editor: Awaited<ReturnType<typeof memberWithRole>>;
let reviewer: Awaited<ReturnType<typeof memberWithRole>>;
let viewer: Awaited<ReturnType<typeof memberWithRole>>;
let nb: NotebookView;
const created: string[] = [];

const MATH = 'The count satisfies $\\pi_2(x) \\sim 2C_2 \\int_2^x \\frac{dt}{\\log^2 t}$ — see\n\n$$C_2 = \\prod_{p>2} \\left(1 - \\frac{1}{(p-1)^2}\\right)$$\n\n<script>alert(1)</script>';

beforeAll(async () => {
  app = await createTestApp();
  ({ client: owner } = await newMember(app, 'owner'));
  nb = await createNotebook(owner, 'Twin prime constant');
  created.push(nb.id);
  await runAll(owner, nb.id);
  nb = (await owner.call('get', `/api/notebooks/${nb.id}`)).body;
  editor = await memberWithRole(app, owner, nb.id, 'editor');
  reviewer = await memberWithRole(app, owner, nb.id, 'reviewer');
  viewer = await memberWithRole(app, owner, nb.id, 'viewer');
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('threads', () => {
  it('opens threads on the notebook, a cell and one output; stores Markdown source verbatim', async () => {
    const cell = nb.cells[0];
    const onNotebook = await reviewer.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: MATH });
    expectStatus(onNotebook, 201);
    expect(onNotebook.body).toMatchObject({ anchor: { kind: 'notebook' }, status: 'open', comments: [{ body: MATH, editedAt: null }] });
    const onCell = await editor.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'cell', cellId: cell.id }, body: 'Why $2^{61}-1$?' });
    expectStatus(onCell, 201);
    const anchor = { kind: 'output', cellId: cell.id, runId: cell.latestRun!.id, outputIndex: 0 };
    const onOutput = await reviewer.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor, body: 'This value is a Mersenne prime.' });
    expectStatus(onOutput, 201);
    expect(onOutput.body.anchor).toEqual(anchor);

    const list: CommentThreadView[] = (await viewer.client.call('get', `/api/notebooks/${nb.id}/threads`)).body;
    expect(list.map((t) => t.anchor.kind)).toEqual(['notebook', 'cell', 'output']);
    const forCell: CommentThreadView[] = (await viewer.client.call('get', `/api/notebooks/${nb.id}/threads?cellId=${cell.id}`)).body;
    expect(forCell).toHaveLength(2);
  });

  it('refuses anchors outside the notebook, missing outputs and empty bodies with field details', async () => {
    const other = await createNotebook(owner, 'Other');
    created.push(other.id);
    const cases: Array<[object, string]> = [
      [{ anchor: { kind: 'cell', cellId: other.cells[0].id }, body: 'x' }, 'anchor.cellId'],
      [{ anchor: { kind: 'output', cellId: nb.cells[0].id, runId: nb.cells[0].latestRun!.id, outputIndex: 5 }, body: 'x' }, 'anchor.outputIndex'],
      [{ anchor: { kind: 'output', cellId: nb.cells[0].id, runId: nb.cells[1].latestRun!.id, outputIndex: 0 }, body: 'x' }, 'anchor.outputIndex'],
      [{ anchor: { kind: 'somewhere' }, body: 'x' }, 'anchor.kind'],
      [{ anchor: { kind: 'cell' }, body: 'x' }, 'anchor.cellId'],
      [{ body: 'x' }, 'anchor'],
      [{ anchor: { kind: 'notebook' }, body: '   ' }, 'body'],
      [{ anchor: { kind: 'notebook' }, body: 'x'.repeat(20_001) }, 'body'],
      [{ anchor: { kind: 'notebook' }, body: 'x', mentions: ['nope'] }, 'mentions'],
    ];
    for (const [body, field] of cases) {
      const res = await owner.call('post', `/api/notebooks/${nb.id}/threads`, body);
      if (res.status !== 400) throw new Error(`${JSON.stringify(body).slice(0, 120)}: expected 400, got ${res.status}`);
      expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
    }
  });

  it('replies, edits only one own comment, resolves and reopens', async () => {
    const t = await owner.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: 'First draft' });
    const threadId = t.body.id;
    const commentId = t.body.comments[0].id;
    const reply = await reviewer.client.call('post', `/api/threads/${threadId}/comments`, { body: 'A reply with $x^2$' });
    expectStatus(reply, 201);
    expect(reply.body).toMatchObject({ threadId, author: { id: reviewer.user.id }, body: 'A reply with $x^2$' });

    expectStatus(await reviewer.client.call('patch', `/api/comments/${commentId}`, { body: 'hijacked' }), 403);
    expectStatus(await viewer.client.call('patch', `/api/comments/${commentId}`, { body: 'hijacked' }), 403);
    const edited = await owner.call('patch', `/api/comments/${commentId}`, { body: 'Second draft' });
    expectStatus(edited, 200);
    expect(edited.body.body).toBe('Second draft');
    expect(edited.body.editedAt).not.toBeNull();

    const resolved = await editor.client.call('post', `/api/threads/${threadId}/resolve`);
    expectStatus(resolved, 200);
    expect(resolved.body).toMatchObject({ status: 'resolved', resolvedBy: { id: editor.user.id } });
    const open: CommentThreadView[] = (await owner.call('get', `/api/notebooks/${nb.id}/threads?status=open`)).body;
    expect(open.find((x) => x.id === threadId)).toBeUndefined();
    const reopened = await reviewer.client.call('post', `/api/threads/${threadId}/reopen`);
    expectStatus(reopened, 200);
    expect(reopened.body).toMatchObject({ status: 'open', resolvedBy: null, resolvedAt: null });
    expect(reopened.body.comments.map((c: { body: string }) => c.body)).toEqual(['Second draft', 'A reply with $x^2$']);
    expectStatus(await owner.call('get', `/api/notebooks/${nb.id}/threads?status=closed`), 400);
  });
});

describe('mentions', () => {
  it('tells a mentioned member by e-mail, once; refuses to mention outsiders', async () => {
    const res = await editor.client.call('post', `/api/notebooks/${nb.id}/threads`, {
      anchor: { kind: 'cell', cellId: nb.cells[1].id },
      body: '@Viewer could you check $6 \\cdot 7$?',
      mentions: [viewer.user.id],
    });
    expectStatus(res, 201);
    expect(res.body.comments[0].mentions).toEqual([{ id: viewer.user.id, displayName: viewer.user.displayName }]);
    const mail = await waitForMail(viewer.email);
    expect(mail.subject).toContain('mentioned you');
    expect(mail.text).toContain(`/notebooks/${nb.id}`);

    // Editing keeps the old mention silent and tells only the new one.
    const commentId = res.body.comments[0].id;
    expectStatus(await editor.client.call('patch', `/api/comments/${commentId}`, { body: '@Viewer @Reviewer please', mentions: [viewer.user.id, reviewer.user.id] }), 200);
    await waitForMail(reviewer.email, 1);
    await sleep(300);
    expect(await mailsTo(viewer.email)).toHaveLength(1);

    const { user: outsider } = await newMember(app, 'outsider');
    const refused = await editor.client.call('post', `/api/threads/${res.body.id}/comments`, { body: 'hey', mentions: [outsider.id] });
    expectStatus(refused, 400);
    expect(refused.body.details[0].field).toBe('mentions');
  });
});
