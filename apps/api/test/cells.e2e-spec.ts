import type { INestApplication } from '@nestjs/common';
import { DataSource } from 'typeorm';
import type { CellView } from '@cribra/contracts';
import { addCell, addMember, createNotebook, NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { createTestApp } from './helpers/test-app';

describe('cells', () => {
  let app: INestApplication;
  let owner: Person;
  let editor: Person;
  let viewer: Person;
  let outsider: Person;

  beforeAll(async () => {
    app = await createTestApp();
    [owner, editor, viewer, outsider] = await Promise.all(['cowner', 'ceditor', 'cviewer', 'coutsider'].map((t) => person(app, t)));
  });
  afterAll(async () => {
    await app.close();
  });

  async function notebookWithTeam(): Promise<string> {
    const nb = await createNotebook(owner);
    await addMember(owner, nb.id, editor, 'editor');
    await addMember(owner, nb.id, viewer, 'viewer');
    return nb.id;
  }

  const revisionOf = async (id: string): Promise<number> => (await owner.client.call('get', `/api/notebooks/${id}`)).body.revision;

  it('adds cells at the end or at a position, and every change bumps the notebook revision', async () => {
    const id = await notebookWithTeam();
    const r0 = await revisionOf(id);
    const a = await addCell(owner, id, 'primorial(5)');
    const c = await addCell(editor, id, 'Notes on the wheel', 'note');
    const b = (await editor.client.call('post', `/api/notebooks/${id}/cells`, { kind: 'claim', source: 'x', position: 1 })).body as CellView;
    expect(a).toMatchObject({ kind: 'query', source: 'primorial(5)', position: 0, revision: 1, latestRun: null, author: { id: owner.id } });
    expect(b.position).toBe(1);
    const nb = (await viewer.client.call('get', `/api/notebooks/${id}`)).body;
    expect(nb.cells.map((x: CellView) => x.id)).toEqual([a.id, b.id, c.id]);
    expect(nb.cells.map((x: CellView) => x.position)).toEqual([0, 1, 2]);
    expect(nb.revision).toBe(r0 + 3);
    expect((await viewer.client.call('get', `/api/cells/${a.id}`)).body.id).toBe(a.id);
  });

  it('saves with optimistic concurrency: a stale revision gets 409 with the current cell', async () => {
    const id = await notebookWithTeam();
    const cell = await addCell(owner, id, 'primorial(7)');
    const first = await editor.client.call('put', `/api/cells/${cell.id}`, { revision: 1, source: 'primorial(11)' });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ revision: 2, source: 'primorial(11)', author: { id: editor.id } });
    const late = await owner.client.call('put', `/api/cells/${cell.id}`, { revision: 1, source: 'primorial(13)' });
    expect(late.status).toBe(409);
    expect(late.body.details).toMatchObject({ reason: 'stale_revision', current: { id: cell.id, revision: 2, source: 'primorial(11)' } });
    const kind = await owner.client.call('put', `/api/cells/${cell.id}`, { revision: 2, kind: 'claim' });
    expect(kind.body).toMatchObject({ kind: 'claim', revision: 3 });
    // Each accepted save is in the notebook's audit, with the cell revision it made; the refused one is not.
    const audit = (await owner.client.call('get', `/api/notebooks/${id}/audit`)).body as Array<{ action: string; actor: { id: string }; details: Record<string, unknown> }>;
    const saves = audit.filter((e) => e.action === 'cell.update').reverse();
    expect(saves.map((e) => [e.actor.id, e.details])).toEqual([
      [editor.id, { cellId: cell.id, revision: 2, fields: ['source'] }],
      [owner.id, { cellId: cell.id, revision: 3, fields: ['kind'] }],
    ]);
  });

  it('refuses bad input (400), missing cells (404), viewers and outsiders (403)', async () => {
    const id = await notebookWithTeam();
    const cell = await addCell(owner, id, 'primorial(5)');
    const bad = await owner.client.call('post', `/api/notebooks/${id}/cells`, { kind: 'chart', source: 3 });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['kind', 'source']));
    expect((await owner.client.call('put', `/api/cells/${cell.id}`, { revision: 1 })).status).toBe(400);
    expect((await owner.client.call('put', `/api/cells/${cell.id}`, { source: 'x' })).status).toBe(400);
    expect((await owner.client.call('post', `/api/notebooks/${id}/cells`, { kind: 'note', source: 'x'.repeat(100_001) })).status).toBe(400);
    expect((await owner.client.call('get', `/api/cells/${NO_SUCH_ID}`)).status).toBe(404);
    expect((await owner.client.call('put', `/api/cells/${NO_SUCH_ID}`, { revision: 1, source: 'x' })).status).toBe(404);
    expect((await owner.client.call('post', `/api/notebooks/${NO_SUCH_ID}/cells`, { kind: 'note', source: 'x' })).status).toBe(404);
    expect((await viewer.client.call('put', `/api/cells/${cell.id}`, { revision: 1, source: 'x' })).status).toBe(403);
    expect((await viewer.client.call('post', `/api/notebooks/${id}/cells`, { kind: 'note', source: 'x' })).status).toBe(403);
    expect((await outsider.client.call('get', `/api/cells/${cell.id}`)).status).toBe(403);
    expect((await viewer.client.call('delete', `/api/cells/${cell.id}`)).status).toBe(403);
  });

  it('deletes a cell (optionally only at a revision) and closes the gap in positions', async () => {
    const id = await notebookWithTeam();
    const [a, b, c] = [await addCell(owner, id, 'a', 'note'), await addCell(owner, id, 'b', 'note'), await addCell(owner, id, 'c', 'note')];
    const stale = await editor.client.call('delete', `/api/cells/${b.id}?revision=7`);
    expect(stale.status).toBe(409);
    expect(stale.body.details.current.id).toBe(b.id);
    expect((await editor.client.call('delete', `/api/cells/${b.id}?revision=1`)).status).toBe(204);
    expect((await editor.client.call('delete', `/api/cells/${b.id}`)).status).toBe(404);
    const cells = (await owner.client.call('get', `/api/notebooks/${id}`)).body.cells as CellView[];
    expect(cells.map((x) => [x.id, x.position])).toEqual([
      [a.id, 0],
      [c.id, 1],
    ]);
  });

  it('reorders all cells at the notebook revision the client saw (409 when stale, 400 when incomplete)', async () => {
    const id = await notebookWithTeam();
    const [a, b, c] = [await addCell(owner, id, 'a', 'note'), await addCell(owner, id, 'b', 'note'), await addCell(owner, id, 'c', 'note')];
    const rev = await revisionOf(id);
    const ok = await editor.client.call('put', `/api/notebooks/${id}/cells/order`, { revision: rev, cellIds: [c.id, a.id, b.id] });
    expect(ok.status).toBe(200);
    expect(ok.body.map((x: CellView) => [x.id, x.position])).toEqual([
      [c.id, 0],
      [a.id, 1],
      [b.id, 2],
    ]);
    const stale = await owner.client.call('put', `/api/notebooks/${id}/cells/order`, { revision: rev, cellIds: [a.id, b.id, c.id] });
    expect(stale.status).toBe(409);
    expect(stale.body.details).toMatchObject({ reason: 'stale_revision', revision: rev + 1 });
    expect(stale.body.details.cells.map((x: CellView) => x.id)).toEqual([c.id, a.id, b.id]);
    const missing = await owner.client.call('put', `/api/notebooks/${id}/cells/order`, { revision: rev + 1, cellIds: [a.id, b.id] });
    expect(missing.status).toBe(400);
    const twice = await owner.client.call('put', `/api/notebooks/${id}/cells/order`, { revision: rev + 1, cellIds: [a.id, a.id, b.id] });
    expect(twice.status).toBe(400);
    expect((await viewer.client.call('put', `/api/notebooks/${id}/cells/order`, { revision: rev + 1, cellIds: [a.id, b.id, c.id] })).status).toBe(403);
  });

  it('refuses every change on a locked notebook with 409', async () => {
    const id = await notebookWithTeam();
    const cell = await addCell(owner, id, 'primorial(5)');
    await app.get(DataSource).query(`UPDATE notebooks SET status = 'locked' WHERE id = $1`, [id]);
    const res = await owner.client.call('put', `/api/cells/${cell.id}`, { revision: 1, source: 'x' });
    expect(res.status).toBe(409);
    expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: id });
    expect((await owner.client.call('post', `/api/notebooks/${id}/cells`, { kind: 'note', source: 'x' })).status).toBe(409);
    expect((await owner.client.call('get', `/api/cells/${cell.id}`)).status).toBe(200);
  });
});
