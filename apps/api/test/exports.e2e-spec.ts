import type { INestApplication } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { addCell, addMember, createNotebook, NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { compileLatex, flat } from './helpers/latex';
import { createTestApp } from './helpers/test-app';

/** Recorded outputs in the shape @cribra/lang produces (a value, a table, a verdict). */
const OUTPUTS = [
  { kind: 'value', label: 'modulus', text: '30030', value: { t: 'int', v: '30030' } },
  {
    kind: 'table',
    label: 'gaps at level 13',
    columns: ['gap', 'count'],
    rows: [
      [{ t: 'int', v: '2' }, { t: 'int', v: '1485' }],
      [{ t: 'int', v: '22' }, { t: 'str', v: 'two, "rare"' }],
    ],
  },
  {
    kind: 'verdict',
    label: null,
    statement: 'count(2) = count(4)',
    holds: true,
    over: 'p ∈ primes 5..23',
    checked: 6,
    skipped: 0,
    first: null,
    last: null,
    counterexample: null,
    summary: 'holds for all 6 cases checked',
  },
];

describe('exports', () => {
  let app: INestApplication;
  let owner: Person;
  let viewer: Person;
  let outsider: Person;
  let notebookId: string;
  let runId: string;

  beforeAll(async () => {
    app = await createTestApp();
    [owner, viewer, outsider] = await Promise.all(['eowner', 'eviewer', 'eoutsider'].map((t) => person(app, t)));
    const nb = await createNotebook(owner, { title: 'Twin & cousin counts_at 10^7', summary: 'Level 13 gap census' });
    notebookId = nb.id;
    await addMember(owner, notebookId, viewer, 'viewer');
    await addCell(owner, notebookId, 'We compare gap counts; see $g = 2$.', 'note');
    const cell = await addCell(owner, notebookId, 'tally(13, 1)');
    await addCell(owner, notebookId, 'primorial(3)');
    const [{ id }] = await app.get(DataSource).query(
      `INSERT INTO runs (notebook_id, cell_id, cell_revision, cell_kind, source, status, requested_by, outputs, output_digest,
                         engine_version, language_version, runner_id, attempts, started_at, finished_at, duration_ms, progress)
       VALUES ($1, $2, 1, 'query', 'tally(13, 1)', 'succeeded', $3, $4, $5, '0.1.0', '0.1.0', 'test-runner', 1, now(), now(), 12, 1)
       RETURNING id`,
      [notebookId, cell.id, owner.id, JSON.stringify(OUTPUTS), 'ab'.repeat(32)],
    );
    runId = id;
  });
  afterAll(async () => {
    await app.close();
  });

  it('exports the notebook as Markdown with results, digests and the checked range of claims', async () => {
    const res = await viewer.client.call('get', `/api/notebooks/${notebookId}/export?format=markdown`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/markdown/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="twin-cousin-counts-at-10-7-r\d+\.md"/);
    const md = res.text;
    expect(md).toContain('# Twin & cousin counts_at 10^7');
    expect(md).toContain('We compare gap counts; see $g = 2$.');
    expect(md).toContain('```sift\ntally(13, 1)\n```');
    expect(md).toContain('modulus = 30030');
    expect(md).toContain('| gap | count |\n| --- | --- |\n| 2 | 1485 |\n| 22 | two, "rare" |');
    expect(md).toContain('holds for every p ∈ primes 5..23 (6 cases, every case checked');
    expect(md).toContain('not a proof');
    expect(md).toContain(`output digest ${'ab'.repeat(32)}`);
    expect(md).toContain('Not run yet.');
  });

  it('exports the notebook as LaTeX with specials escaped', async () => {
    const res = await owner.client.call('get', `/api/notebooks/${notebookId}/export?format=latex`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/x-latex/);
    const tex = res.text;
    expect(tex.startsWith('\\documentclass[11pt]{article}')).toBe(true);
    expect(tex).toContain('\\title{Twin \\& cousin counts\\_at 10\\textasciicircum{}7}');
    expect(tex).toContain('\\begin{lstlisting}[style=sift]\ntally(13, 1)\n\\end{lstlisting}');
    // The gap column is all numbers (right-aligned), the count column is not.
    expect(tex).toContain('\\begin{longtable}{@{}rl@{}}');
    expect(tex).toContain('22 & two, "rare" \\\\');
    // The note's maths stays maths.
    expect(tex).toContain('We compare gap counts; see $g = 2$.');
    const pdf = compileLatex(tex);
    expect(pdf.errors).toEqual([]);
    expect(flat(pdf.text)).toContain('holds for every p ∈ primes 5..23 (6 cases, every case checked');
    expect(tex.trimEnd().endsWith('\\end{document}')).toBe(true);
    const actions = (await owner.client.call('get', `/api/notebooks/${notebookId}/audit`)).body.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['export.markdown', 'export.latex']));
  });

  it('exports a table output as CSV and as JSON', async () => {
    const csv = await viewer.client.call('get', `/api/runs/${runId}/outputs/1/export?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.text).toBe('gap,count\r\n2,1485\r\n22,"two, ""rare"""\r\n');
    const json = await viewer.client.call('get', `/api/runs/${runId}/outputs/1/export?format=json`);
    expect(JSON.parse(json.text)).toEqual([
      { gap: { t: 'int', v: '2' }, count: { t: 'int', v: '1485' } },
      { gap: { t: 'int', v: '22' }, count: { t: 'str', v: 'two, "rare"' } },
    ]);
  });

  it('refuses bad formats and non-tables (400), outsiders (403), missing things (404)', async () => {
    expect((await owner.client.call('get', `/api/notebooks/${notebookId}/export?format=pdf`)).status).toBe(400);
    expect((await owner.client.call('get', `/api/notebooks/${notebookId}/export`)).status).toBe(400);
    const notTable = await owner.client.call('get', `/api/runs/${runId}/outputs/0/export?format=csv`);
    expect(notTable.status).toBe(400);
    expect(notTable.body.message).toMatch(/not a table/);
    expect((await owner.client.call('get', `/api/runs/${runId}/outputs/9/export?format=csv`)).status).toBe(404);
    expect((await outsider.client.call('get', `/api/notebooks/${notebookId}/export?format=markdown`)).status).toBe(403);
    expect((await outsider.client.call('get', `/api/runs/${runId}/outputs/1/export?format=csv`)).status).toBe(403);
    expect((await owner.client.call('get', `/api/notebooks/${NO_SUCH_ID}/export?format=markdown`)).status).toBe(404);
    expect((await owner.client.call('get', `/api/runs/${NO_SUCH_ID}/outputs/1/export?format=csv`)).status).toBe(404);
  });
});
