import type { INestApplication } from '@nestjs/common';
import { DataSource } from 'typeorm';
import type { NotebookSummary, Page } from '@cribra/contracts';
import { addMember, createNotebook, NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { createTestApp, newAdmin } from './helpers/test-app';

describe('notebooks and members', () => {
  let app: INestApplication;
  let owner: Person;
  let editor: Person;
  let viewer: Person;
  let outsider: Person;

  beforeAll(async () => {
    app = await createTestApp();
    [owner, editor, viewer, outsider] = await Promise.all(['owner', 'editor', 'viewer', 'outsider'].map((t) => person(app, t)));
  });
  afterAll(async () => {
    await app.close();
  });

  it('creates a notebook: owner membership, defaults, normalised tags, audit entry', async () => {
    const nb = await createNotebook(owner, { title: '  Narrow 10-tuples  ', summary: 'Counting them', tags: ['Tuples', 'tuples', 'narrow'] });
    expect(nb).toMatchObject({
      title: 'Narrow 10-tuples',
      summary: 'Counting them',
      tags: ['tuples', 'narrow'],
      status: 'draft',
      revision: 1,
      requiredSignoffs: 1,
      myRole: 'owner',
      cellCount: 0,
      cells: [],
      owner: { id: owner.id },
    });
    expect(nb.members).toEqual([expect.objectContaining({ userId: owner.id, role: 'owner' })]);
    const audit = await owner.client.call('get', `/api/notebooks/${nb.id}/audit`);
    expect(audit.status).toBe(200);
    expect(audit.body.map((e: { action: string }) => e.action)).toContain('notebook.create');
  });

  it('refuses bad input with 400 and field details', async () => {
    const res = await owner.client.call('post', '/api/notebooks', { title: '', tags: ['ok', 'no spaces allowed'], requiredSignoffs: 0, extra: 1 });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ statusCode: 400, error: 'Bad Request' });
    const fields = res.body.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['title', 'tags', 'requiredSignoffs', 'extra']));
    expect((await owner.client.call('get', '/api/notebooks?status=final')).status).toBe(400);
    expect((await owner.client.call('get', '/api/notebooks/not-a-uuid')).status).toBe(400);
  });

  it('needs a session and the CSRF header', async () => {
    const { Client } = await import('./helpers/test-app');
    expect((await new Client(app).call('get', '/api/notebooks')).status).toBe(401);
    expect((await owner.client.call('post', '/api/notebooks', { title: 'x' }, { csrf: false })).status).toBe(403);
  });

  it('reads with membership only: 403 for outsiders, 404 for unknown notebooks', async () => {
    const nb = await createNotebook(owner);
    expect((await owner.client.call('get', `/api/notebooks/${nb.id}`)).status).toBe(200);
    const res = await outsider.client.call('get', `/api/notebooks/${nb.id}`);
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/not a member/);
    expect((await owner.client.call('get', `/api/notebooks/${NO_SUCH_ID}`)).status).toBe(404);
    expect((await owner.client.call('patch', `/api/notebooks/${NO_SUCH_ID}`, { revision: 1, title: 'x' })).status).toBe(404);
    expect((await owner.client.call('delete', `/api/notebooks/${NO_SUCH_ID}`)).status).toBe(404);
  });

  it('updates with optimistic concurrency: a stale revision gets 409 with the current notebook', async () => {
    const nb = await createNotebook(owner);
    await addMember(owner, nb.id, editor, 'editor');
    const ok = await editor.client.call('patch', `/api/notebooks/${nb.id}`, { revision: 1, title: 'Renamed', tags: ['wheel'] });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ title: 'Renamed', tags: ['wheel'], revision: 2, myRole: 'editor' });
    const stale = await owner.client.call('patch', `/api/notebooks/${nb.id}`, { revision: 1, summary: 'late edit' });
    expect(stale.status).toBe(409);
    expect(stale.body.details).toMatchObject({ reason: 'stale_revision', current: { id: nb.id, revision: 2, title: 'Renamed' } });
    expect((await owner.client.call('patch', `/api/notebooks/${nb.id}`, { title: 'no revision' })).status).toBe(400);
  });

  it('enforces roles: viewers read but do not edit; only the owner deletes and manages members', async () => {
    const nb = await createNotebook(owner);
    await addMember(owner, nb.id, editor, 'editor');
    await addMember(owner, nb.id, viewer, 'viewer');
    expect((await viewer.client.call('get', `/api/notebooks/${nb.id}`)).body.myRole).toBe('viewer');
    expect((await viewer.client.call('patch', `/api/notebooks/${nb.id}`, { revision: 1, title: 'x' })).status).toBe(403);
    expect((await editor.client.call('delete', `/api/notebooks/${nb.id}`)).status).toBe(403);
    expect((await editor.client.call('post', `/api/notebooks/${nb.id}/members`, { email: outsider.email, role: 'viewer' })).status).toBe(403);
    expect((await outsider.client.call('get', `/api/notebooks/${nb.id}/members`)).status).toBe(403);
    expect((await editor.client.call('get', `/api/notebooks/${nb.id}/audit`)).status).toBe(403);
    expect((await owner.client.call('delete', `/api/notebooks/${nb.id}`)).status).toBe(204);
    expect((await owner.client.call('get', `/api/notebooks/${nb.id}`)).status).toBe(404);
  });

  it('manages members: add by e-mail, change role, remove; the owner stays', async () => {
    const nb = await createNotebook(owner);
    const add = await owner.client.call('post', `/api/notebooks/${nb.id}/members`, { email: viewer.email.toUpperCase(), role: 'reviewer' });
    expect(add.status).toBe(201);
    expect(add.body).toMatchObject({ userId: viewer.id, role: 'reviewer' });
    expect((await owner.client.call('post', `/api/notebooks/${nb.id}/members`, { email: viewer.email, role: 'viewer' })).status).toBe(409);
    expect((await owner.client.call('post', `/api/notebooks/${nb.id}/members`, { email: 'nobody@test.example', role: 'viewer' })).status).toBe(404);
    expect((await owner.client.call('post', `/api/notebooks/${nb.id}/members`, { email: viewer.email, role: 'owner' })).status).toBe(400);
    const change = await owner.client.call('patch', `/api/notebooks/${nb.id}/members/${viewer.id}`, { role: 'viewer' });
    expect(change.status).toBe(200);
    expect(change.body.role).toBe('viewer');
    expect((await owner.client.call('patch', `/api/notebooks/${nb.id}/members/${owner.id}`, { role: 'viewer' })).status).toBe(400);
    expect((await owner.client.call('delete', `/api/notebooks/${nb.id}/members/${owner.id}`)).status).toBe(400);
    expect((await owner.client.call('patch', `/api/notebooks/${nb.id}/members/${outsider.id}`, { role: 'viewer' })).status).toBe(404);
    const list = await viewer.client.call('get', `/api/notebooks/${nb.id}/members`);
    expect(list.body.map((m: { role: string }) => m.role)).toEqual(['owner', 'viewer']);
    expect((await owner.client.call('delete', `/api/notebooks/${nb.id}/members/${viewer.id}`)).status).toBe(204);
    expect((await viewer.client.call('get', `/api/notebooks/${nb.id}`)).status).toBe(403);
    const actions = (await owner.client.call('get', `/api/notebooks/${nb.id}/audit`)).body.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['member.add', 'member.role', 'member.remove']));
  });

  it('lists my notebooks with search, tag, status and role filters and paging', async () => {
    const me = await person(app, 'lister');
    const a = await createNotebook(me, { title: 'Sieve records below 1e9', tags: ['ledger'] });
    const b = await createNotebook(me, { title: 'Wheel histogram drift', summary: 'How the histogram of 17# moves', tags: ['wheel'] });
    const theirs = await createNotebook(owner, { title: 'Shared wheel study', tags: ['wheel'] });
    await addMember(owner, theirs.id, me, 'reviewer');
    await createNotebook(owner, { title: 'Private wheel notes', tags: ['wheel'] });
    await app.get(DataSource).query(`UPDATE notebooks SET status = 'in_review' WHERE id = $1`, [b.id]);

    const list = async (q: string): Promise<Page<NotebookSummary>> => (await me.client.call('get', `/api/notebooks${q}`)).body;
    const titles = (p: Page<NotebookSummary>) => p.items.map((n) => n.title).sort();
    expect((await list('')).total).toBe(3);
    expect(titles(await list('?tag=wheel'))).toEqual(['Shared wheel study', 'Wheel histogram drift']);
    expect(titles(await list('?q=histogram'))).toEqual(['Wheel histogram drift']);
    expect(titles(await list('?q=siev'))).toEqual(['Sieve records below 1e9']);
    expect(titles(await list('?status=in_review'))).toEqual(['Wheel histogram drift']);
    const reviewing = await list('?role=reviewer');
    expect(reviewing.items.map((n) => [n.title, n.myRole])).toEqual([['Shared wheel study', 'reviewer']]);
    const page = await list('?pageSize=2&page=2');
    expect(page).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(page.items).toHaveLength(1);
    expect((await list('?tag=ledger')).items.map((n) => n.id)).toEqual([a.id]);

    const admin = await newAdmin(app);
    const all = (await admin.client.call('get', '/api/notebooks?q=wheel&pageSize=100')).body as Page<NotebookSummary>;
    expect(all.items.map((n) => n.title)).toEqual(expect.arrayContaining(['Private wheel notes', 'Shared wheel study']));
  });

  it('documents every notebook route in the OpenAPI document at /api/docs', async () => {
    const res = await owner.client.call('get', '/api/docs-json');
    expect(res.status).toBe(200);
    const paths = Object.keys(res.body.paths);
    for (const p of [
      '/api/notebooks',
      '/api/notebooks/{id}',
      '/api/notebooks/{id}/members',
      '/api/notebooks/{id}/cells',
      '/api/notebooks/{id}/cells/order',
      '/api/cells/{id}',
      '/api/cells/{id}/runs',
      '/api/notebooks/{id}/runs',
      '/api/runs/{id}/cancel',
      '/api/notebooks/{id}/events',
      '/api/levels/{prime}/computations',
      '/api/ledger/range',
      '/api/notebooks/{id}/uploads',
      '/api/notebooks/{id}/export',
      '/api/computations/{id}',
    ]) {
      expect(paths).toContain(p);
    }
    expect(res.body.components.schemas.CreateNotebookDto.required).toEqual(['title']);
  });
});
