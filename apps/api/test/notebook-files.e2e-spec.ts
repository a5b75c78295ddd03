// Notebook files: cell titles, `.sift` export and import through the API (round trip with the same
// cells, titles and run digests), refused files with their lines (nothing stored), and the exported
// file run by `cribra run` giving the same output digests as the runner's runs.
import type { INestApplication } from '@nestjs/common';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER, type CellView, type NotebookView, type RunView } from '@cribra/contracts';
import { deleteNotebooks, expectStatus, runAll } from './helpers/review-fixtures';
import { Client, createTestApp, newMember } from './helpers/test-app';

const CLI = join(__dirname, '../../cli/dist/main.js');

let app: INestApplication;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

/** POST /api/notebooks/import with `text` as the multipart file. */
async function importFile(client: Client, text: string | Buffer, fileName = 'notebook.sift', type = 'text/plain') {
  const token = client.csrf ?? (await client.fetchCsrf());
  return request(app.getHttpServer())
    .post('/api/notebooks/import')
    .set('Cookie', [...client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8'), { filename: fileName, contentType: type });
}

/** Cells with titles (and without), a claim, a note whose lines look like markers. */
const CELLS: Array<{ kind: string; title?: string; source: string }> = [
  { kind: 'note', title: 'What this checks', source: 'Primes above 2 are odd.\n@@ not a marker\n\\@@ nor this' },
  { kind: 'query', title: 'The primorial 7#', source: 'show 7# as "p7"' },
  // OEIS A000040: the primes 3..47 are 14 primes, all odd.
  { kind: 'claim', title: 'Odd primes', source: 'claim p mod 2 = 1 over p ∈ primes 3..50' },
  // OEIS A002110: primorials 2, 6, 30, 210, 2310, 30030.
  { kind: 'query', source: 'table[p ∈ primes 2..13](p: p, primorial: p#)' },
];

async function notebookWithCells(owner: Client): Promise<NotebookView> {
  const res = await owner.call('post', '/api/notebooks', { title: 'Odd primes, exported', summary: 'A summary.', tags: ['files', 'primes'] });
  expectStatus(res, 201);
  created.push(res.body.id);
  for (const c of CELLS) expectStatus(await owner.call('post', `/api/notebooks/${res.body.id}/cells`, c), 201);
  return (await owner.call('get', `/api/notebooks/${res.body.id}`)).body;
}

const digests = (nb: NotebookView): Array<string | null> => nb.cells.map((c) => c.latestRun?.outputDigest ?? null);

describe('cell titles', () => {
  it('are stored, changed alone without a new cell revision, cleared, and validated', async () => {
    const { client: owner } = await newMember(app, 'titles');
    const nb = await notebookWithCells(owner);
    expect(nb.cells.map((c) => c.title)).toEqual(['What this checks', 'The primorial 7#', 'Odd primes', null]);
    const cell = nb.cells[1]!;
    const renamed = await owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision, title: '  Seven primorial ' });
    expectStatus(renamed, 200);
    expect(renamed.body).toMatchObject({ title: 'Seven primorial', revision: cell.revision, source: cell.source });
    const cleared = await owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision, title: null });
    expectStatus(cleared, 200);
    expect((cleared.body as CellView).title).toBeNull();
    const edited = await owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision, source: 'show 11#' });
    expect(edited.body.revision).toBe(cell.revision + 1);
    const twoLines = await owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision + 1, title: 'a\nb' });
    expectStatus(twoLines, 400);
    expect(JSON.stringify(twoLines.body.details)).toMatch(/one line/);
    const long = await owner.call('post', `/api/notebooks/${nb.id}/cells`, { kind: 'query', source: 'show 1', title: 'x'.repeat(201) });
    expectStatus(long, 400);
  });
});

describe('.sift export and import', () => {
  it('round-trips cells, titles and run digests through the API', async () => {
    const { client: owner } = await newMember(app, 'sift-export');
    const nb = await notebookWithCells(owner);
    await runAll(owner, nb.id);
    const before: NotebookView = (await owner.call('get', `/api/notebooks/${nb.id}`)).body;

    const exported = await owner.call('get', `/api/notebooks/${nb.id}/export?format=sift`);
    expectStatus(exported, 200);
    expect(exported.headers['content-type']).toMatch(/^text\/plain/);
    expect(exported.headers['content-disposition']).toMatch(/\.sift"$/);
    const text = exported.text;
    expect(text).toContain('@@@ title: Odd primes, exported\n');
    expect(text).toContain('@@ claim Odd primes\nclaim p mod 2 = 1 over p ∈ primes 3..50\n');

    const imported = await importFile(owner, text, 'odd-primes.sift');
    expectStatus(imported, 201);
    const copy: NotebookView = imported.body;
    created.push(copy.id);
    expect(copy).toMatchObject({ title: before.title, summary: 'A summary.', tags: ['files', 'primes'], status: 'draft', myRole: 'owner' });
    expect(copy.cells.map((c) => [c.kind, c.title, c.source])).toEqual(before.cells.map((c) => [c.kind, c.title, c.source]));
    expect(copy.cells.every((c) => c.latestRun === null)).toBe(true);

    await runAll(owner, copy.id);
    const after: NotebookView = (await owner.call('get', `/api/notebooks/${copy.id}`)).body;
    expect(digests(after)).toEqual(digests(before));
    expect(digests(after).filter(Boolean)).toHaveLength(3);
    // The copy exports to the same file (the title line aside, nothing differs).
    expect((await owner.call('get', `/api/notebooks/${copy.id}/export?format=sift`)).text).toBe(text);
  });

  it('refuses a file with errors, listing their lines, and stores nothing', async () => {
    const { client: owner } = await newMember(app, 'sift-bad');
    const count = async () => (await owner.call('get', '/api/notebooks')).body.total as number;
    const n0 = await count();
    const bad = '@@@ title: Broken\n\n@@ query\nshow 1\n@@ sketch\nshow 2\n@@ claim\nclaim 1 = 1\n@@@ tags: late\n';
    const res = await importFile(owner, bad);
    expectStatus(res, 400);
    expect(res.body.message).toBe("Line 5: unknown cell kind 'sketch'; a cell is query, claim or note");
    expect(res.body.details).toEqual({
      reason: 'parse_error',
      errors: [
        { line: 5, message: "unknown cell kind 'sketch'; a cell is query, claim or note" },
        { line: 9, message: 'header lines (@@@) belong before the first cell' },
      ],
    });
    const tooLongTitle = await importFile(owner, `@@ query ${'t'.repeat(201)}\nshow 1\n`);
    expectStatus(tooLongTitle, 400);
    expect(tooLongTitle.body.details.errors).toEqual([{ line: 1, message: 'the cell title is longer than 200 characters' }]);
    expectStatus(await importFile(owner, '@@ query\nshow 1\n', 'notebook.pdf'), 400);
    expectStatus(await importFile(owner, Buffer.from([0x40, 0x40, 0x20, 0xff, 0xfe, 0x0a])), 400);
    const huge = await importFile(owner, `@@ note\n${'x'.repeat(2 * 1024 * 1024)}\n`);
    expect([400, 413]).toContain(huge.status);
    expect(await count()).toBe(n0);
    const none: Array<{ n: number }> = await app.get(DataSource).query(`SELECT count(*)::int AS n FROM notebooks WHERE title = 'Broken'`);
    expect(none[0]!.n).toBe(0);
  });

  it('an exported file run with `cribra run` gives the same output digests as the runner', async () => {
    const { client: owner } = await newMember(app, 'sift-cli');
    const nb = await notebookWithCells(owner);
    const runs: RunView[] = await runAll(owner, nb.id);
    const text = (await owner.call('get', `/api/notebooks/${nb.id}/export?format=sift`)).text;
    const file = join(mkdtempSync(join(tmpdir(), 'cribra-sift-')), 'exported.sift');
    writeFileSync(file, text);
    const r = spawnSync(process.execPath, [CLI, 'run', file, '--json', '--workers', '1'], { encoding: 'utf8', timeout: 120_000 });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { cells: Array<{ kind: string; title: string | null; digest?: string }> };
    expect(out.cells.map((c) => c.title)).toEqual(CELLS.map((c) => c.title ?? null));
    const byCell = new Map(runs.map((x) => [x.cellId, x.outputDigest]));
    const web = nb.cells.filter((c) => c.kind !== 'note').map((c) => byCell.get(c.id));
    expect(out.cells.filter((c) => c.kind !== 'note').map((c) => c.digest)).toEqual(web);
  });
});
