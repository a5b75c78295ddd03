// Published records: an owner publishes a locked notebook's record at /records/<id> (id from the
// record's hash); anyone reads it signed out, with downloads, citation and the verify command; an
// unpublished record answers 404 exactly like a random id; a published record never changes; a
// withdrawal keeps it readable under a banner; audit events for both.
import { createHash } from 'node:crypto';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import type { LockRecord, PublishedRecordView } from '@cribra/contracts';
import { parseNotebookFile } from '@cribra/lang';
import { recordIdOf, recordSha256 } from '../src/records/record-hash';
import { compileLatex, flat } from './helpers/latex';
import { deleteNotebooks, expectStatus, memberWithRole, runAll, verifyAndSignOff } from './helpers/review-fixtures';
import { Client, createTestApp, newMember } from './helpers/test-app';
import { CSRF_HEADER } from '@cribra/contracts';
import { sqlFails } from './helpers/sql-as';

let app: INestApplication;
const created: string[] = [];

const CELLS: Array<{ kind: string; source: string }> = [
  { kind: 'note', source: 'Counts of gaps in the wheel; maths such as $\\varphi(p\\#)$ stays maths.' },
  { kind: 'query', source: 'table[p ∈ primes 5..13](level: p, members: wheelsize(p))' },
  { kind: 'claim', source: 'claim balance: gapcount(2, p) = gapcount(4, p)\n  over p ∈ primes 3..13' },
  { kind: 'query', source: 'let t = table[p ∈ primes 5..13](level: p, twos: gapcount(2, p))\ndraw line t: level -> twos log y as "Gaps 2 by level"' },
  { kind: 'query', source: 'let H = upload("pattern")\nshow admissible(H) as "admissible"' },
];
const UPLOAD = Buffer.from('# the prime triplet pattern\n0\n2\n6\n');

async function lockedNotebook(owner: Client, title: string): Promise<{ id: string; record: LockRecord; editor: Client; reviewer: Client }> {
  const res = await owner.call('post', '/api/notebooks', { title, summary: 'Gap counts by wheel level, checked exactly.' });
  expectStatus(res, 201);
  const id = res.body.id as string;
  created.push(id);
  const token = owner.csrf ?? (await owner.fetchCsrf());
  const up = await request(app.getHttpServer())
    .post(`/api/notebooks/${id}/uploads`)
    .set('Cookie', [...owner.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .field('name', 'pattern')
    .attach('file', UPLOAD, 'pattern.txt');
  expectStatus(up, 201);
  for (const c of CELLS) expectStatus(await owner.call('post', `/api/notebooks/${id}/cells`, c), 201);
  await runAll(owner, id);
  const editor = (await memberWithRole(app, owner, id, 'editor')).client;
  const reviewer = (await memberWithRole(app, owner, id, 'reviewer')).client;
  expectStatus(await owner.call('post', `/api/notebooks/${id}/review/request`, {}), 200);
  await verifyAndSignOff(reviewer, id);
  const lock = await owner.call('post', `/api/notebooks/${id}/lock`);
  expectStatus(lock, 201);
  return { id, record: lock.body, editor, reviewer };
}

beforeAll(async () => {
  app = await createTestApp();
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('published records', () => {
  let owner: Client;
  let anon: Client;
  let nb: Awaited<ReturnType<typeof lockedNotebook>>;
  let rid: string;
  let sha: string;
  jest.setTimeout(180_000);

  beforeAll(async () => {
    owner = (await newMember(app, 'rowner')).client;
    anon = new Client(app);
    nb = await lockedNotebook(owner, 'Twin & cousin gaps by level');
    sha = recordSha256(nb.record);
    rid = recordIdOf(sha);
  });

  it('answers 404 for an unpublished record exactly as for a random or malformed id', async () => {
    const unpublished = await anon.call('get', `/api/records/${rid}`);
    const random = await anon.call('get', `/api/records/${'0123456789abcdef0123'}`);
    const malformed = await anon.call('get', '/api/records/not-an-id');
    expect(unpublished.status).toBe(404);
    expect(unpublished.body).toEqual(random.body);
    expect(unpublished.text).toBe(random.text);
    expect(malformed.text).toBe(random.text);
    expect((await anon.call('get', `/api/records/${rid}/export?format=json`)).text).toBe((await anon.call('get', `/api/records/${'0123456789abcdef0123'}/export?format=json`)).text);
  });

  it('is published by the owner only, once, and only when locked', async () => {
    expectStatus(await nb.editor.call('post', `/api/notebooks/${nb.id}/publication`), 403);
    expectStatus(await nb.reviewer.call('post', `/api/notebooks/${nb.id}/publication`), 403);
    // Signed out: refused before anything else (no CSRF token, no session).
    expect([401, 403]).toContain((await anon.call('post', `/api/notebooks/${nb.id}/publication`)).status);
    expect((await anon.call('get', `/api/notebooks/${nb.id}/publication`)).status).toBe(401);
    const draft = await owner.call('post', '/api/notebooks', { title: 'A draft' });
    created.push(draft.body.id);
    const refused = await owner.call('post', `/api/notebooks/${draft.body.id}/publication`);
    expectStatus(refused, 409);
    expect(refused.body.details).toEqual({ reason: 'not_locked' });

    const res = await owner.call('post', `/api/notebooks/${nb.id}/publication`);
    expectStatus(res, 201);
    expect(res.body).toMatchObject({ id: rid, notebookId: nb.id, recordSha256: sha, withdrawal: null });
    expect(res.body.url).toMatch(new RegExp(`/records/${rid}$`));
    const again = await owner.call('post', `/api/notebooks/${nb.id}/publication`);
    expectStatus(again, 409);
    expect(again.body.details).toEqual({ reason: 'already_published', id: rid });
    expect((await nb.editor.call('get', `/api/notebooks/${nb.id}/publication`)).body.id).toBe(rid);
  });

  it('is read signed out: verdicts, sources, outputs, charts, reviewers, uploads with hashes, citation, verify command', async () => {
    const res = await anon.call('get', `/api/records/${rid}`);
    expectStatus(res, 200);
    const v = res.body as PublishedRecordView;
    expect(v.title).toBe('Twin & cousin gaps by level');
    expect(v.record).toEqual(nb.record);
    expect(v.cells.map((c) => c.source)).toEqual(CELLS.map((c) => c.source));
    const verdict = v.cells[2].outputs?.find((o) => o.kind === 'verdict') as { holds: boolean; over: string; checked: number };
    // balance of gaps 2 and 4 at levels 3..13: five levels checked.
    expect(verdict).toMatchObject({ holds: true, over: 'p ∈ primes 3..13', checked: 5 });
    // φ(13#) = 5760 (OEIS A005867).
    expect(JSON.stringify(v.cells[1].outputs)).toContain('"5760"');
    expect(v.cells[3].outputs?.some((o) => o.kind === 'chart')).toBe(true);
    expect(v.reviewers).toHaveLength(1);
    expect(v.authors.map((a) => a.displayName)).toHaveLength(2); // owner and editor
    expect(v.uploads).toEqual([{ name: 'pattern', kind: 'tuples', mediaType: expect.any(String), sizeBytes: UPLOAD.length, sha256: createHash('sha256').update(UPLOAD).digest('hex') }]);
    expect(v.citation.bibtex).toMatch(new RegExp(`^@misc\\{cribra-${rid},`));
    for (const part of [v.title.replace('&', '\\&'), v.reviewers[0].displayName, sha, v.url, v.record.lockedAt.slice(0, 4)]) expect(v.citation.bibtex).toContain(part);
    for (const part of [v.title, v.authors[0].displayName, v.reviewers[0].displayName, sha, v.url, v.record.lockedAt.slice(0, 10)]) expect(v.citation.text).toContain(part);
    expect(v.verifyCommand).toBe(`cribra verify ${v.url.replace(`/records/${rid}`, '')}/api/records/${rid}/export?format=json`);
  });

  it('offers JSON (the lock record itself), Markdown, LaTeX that compiles, a .sift file and the uploads, signed out', async () => {
    const json = await anon.call('get', `/api/records/${rid}/export?format=json`);
    expectStatus(json, 200);
    expect(JSON.parse(json.text)).toEqual(nb.record);
    expect(recordSha256(JSON.parse(json.text))).toBe(sha);
    const md = await anon.call('get', `/api/records/${rid}/export?format=markdown`);
    expect(md.headers['content-disposition']).toBe(`attachment; filename="record-${rid}.md"`);
    expect(md.text).toContain(`Record SHA-256: ${sha}`);
    expect(md.text).toContain('Claim balance holds for every p ∈ primes 3..13 (5 cases, every case checked).');
    const tex = await anon.call('get', `/api/records/${rid}/export?format=latex`);
    expectStatus(tex, 200);
    expect(tex.text).toContain('\\begin{axis}');
    const pdf = compileLatex(tex.text);
    expect(pdf.errors).toEqual([]);
    expect(flat(pdf.text)).toContain('holds for every p ∈ primes 3..13 (5 cases, every case checked)');
    expect(flat(pdf.text)).toContain(sha);
    const sift = await anon.call('get', `/api/records/${rid}/export?format=sift`);
    const parsed = parseNotebookFile(sift.text);
    expect(parsed.errors).toEqual([]);
    expect(parsed.notebook.cells.map((c) => [c.kind, c.source])).toEqual(CELLS.map((c) => [c.kind, c.source]));
    const file = await request(app.getHttpServer())
      .get(`/api/records/${rid}/uploads/pattern`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expectStatus(file, 200);
    expect(file.headers['content-disposition']).toBe('attachment; filename="pattern.txt"');
    expect(createHash('sha256').update(file.body as Buffer).digest('hex')).toBe(createHash('sha256').update(UPLOAD).digest('hex'));
    expectStatus(await anon.call('get', `/api/records/${rid}/uploads/nothing`), 404);
    expectStatus(await anon.call('get', `/api/records/${rid}/export?format=pdf`), 400);
  });

  it('never changes: the database refuses edits and deletion of a published record', async () => {
    expect(await sqlFails(`UPDATE published_records SET record = '{}' WHERE id = $1`, [rid])).toBe('CRPUB');
    expect(await sqlFails(`UPDATE published_records SET content = '{}' WHERE id = $1`, [rid])).toBe('CRPUB');
    expect(await sqlFails(`DELETE FROM published_records WHERE id = $1`, [rid])).toBe('CRPUB');
    // Only GET exists publicly: a state-changing request to a record is not accepted.
    expect([403, 404]).toContain((await anon.call('post', `/api/records/${rid}`, {})).status);
    expect([403, 404]).toContain((await anon.call('delete', `/api/records/${rid}`)).status);
  });

  it('is withdrawn by its owner with a reason, once, and stays readable under the withdrawal', async () => {
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/publication/withdrawal`, { reason: '   ' }), 400);
    expectStatus(await nb.editor.call('post', `/api/notebooks/${nb.id}/publication/withdrawal`, { reason: 'no' }), 403);
    const res = await owner.call('post', `/api/notebooks/${nb.id}/publication/withdrawal`, { reason: 'The level-13 table used a stale engine.' });
    expectStatus(res, 200);
    expect(res.body.withdrawal).toMatchObject({ reason: 'The level-13 table used a stale engine.' });
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/publication/withdrawal`, { reason: 'again' }), 409);
    const view = await anon.call('get', `/api/records/${rid}`);
    expectStatus(view, 200);
    expect(view.body.withdrawal.reason).toBe('The level-13 table used a stale engine.');
    expect(view.body.record).toEqual(nb.record);
    expect((await anon.call('get', `/api/records/${rid}/export?format=markdown`)).text).toContain('WITHDRAWN');
    expect(await sqlFails(`UPDATE published_records SET withdraw_reason = 'edited' WHERE id = $1`, [rid])).toBe('CRPUB');
    const audit = (await owner.call('get', `/api/notebooks/${nb.id}/audit`)).body as Array<{ action: string; details: Record<string, unknown> }>;
    const publish = audit.find((e) => e.action === 'record.publish');
    const withdraw = audit.find((e) => e.action === 'record.withdraw');
    expect(publish?.details).toMatchObject({ recordId: rid, recordSha256: sha });
    expect(withdraw?.details).toMatchObject({ recordId: rid, reason: 'The level-13 table used a stale engine.' });
  });
});
