// The self-contained lock record: contents (summary, authors, titles, outputs, claims with binders
// and counterexamples, uploads read with embedded content, sign-offs with their re-verifications),
// validated against docs/lock-record.schema.json, re-hashed, rendered to Markdown, verified offline
// by `cribra verify`; records locked before v1 still read and still pass a lock check.
import type { INestApplication } from '@nestjs/common';
import Ajv from 'ajv';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { canonicalJson } from '@cribra/lang';
import { CSRF_HEADER, type LockRecord, type NotebookView } from '@cribra/contracts';
import { deleteNotebooks, expectStatus, memberWithRole, runAll, verifyAndSignOff, waitVerification } from './helpers/review-fixtures';
import { Client, createTestApp, newMember } from './helpers/test-app';
import { asOwner } from './helpers/sql-as';

const ROOT = join(__dirname, '../../..');
const CLI = join(ROOT, 'apps/cli/dist/main.js');
const schema = JSON.parse(readFileSync(join(ROOT, 'docs/lock-record.schema.json'), 'utf8'));
const validate = new Ajv({ allErrors: true, strict: false }).compile(schema);
const TRIPLE_FILE = '# an admissible triple\n0\n2\n6\n';

let app: INestApplication;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

const rehash = (r: LockRecord): string => {
  const { recordSha256: _drop, ...rest } = r;
  return createHash('sha256').update(canonicalJson(rest), 'utf8').digest('hex');
};

function expectValid(r: unknown): void {
  if (!validate(r)) throw new Error(`record does not match docs/lock-record.schema.json: ${JSON.stringify(validate.errors, null, 2)}`);
}

async function uploadTriple(client: Client, notebookId: string): Promise<void> {
  const token = client.csrf ?? (await client.fetchCsrf());
  const res = await request(app.getHttpServer())
    .post(`/api/notebooks/${notebookId}/uploads`)
    .set('Cookie', [...client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .field('name', 'triple')
    .attach('file', Buffer.from(TRIPLE_FILE), 'triple.txt');
  expectStatus(res, 201);
}

const CELLS = [
  { kind: 'note', title: 'Aim', source: 'Occurrences of the triple $\\{0, 2, 6\\}$ and two claims.' },
  // hits(H, 13) = ∏_{q ≤ 13}(q − ν_q(H)) = 1·1·2·4·8·10 = 640 for H = {0, 2, 6} (docs/language.md).
  { kind: 'query', title: 'Occurrences at level 13', source: 'show hits(upload("triple"), 13) as "hits"' },
  // OEIS A000040: 3..47 are 14 primes, all odd.
  { kind: 'claim', title: 'Odd primes', source: 'claim p mod 2 = 1 over p ∈ primes 3..50' },
  // n² + n + 41 at n = 41 is 1763 = 41 · 43 (Euler's polynomial), the first n with a value ≥ 1700.
  { kind: 'claim', title: 'A bound that fails', source: 'claim n^2 + n + 41 < 1700 over n ∈ 0..50, n mod 1 = 0' },
  { kind: 'query', title: 'Primorials', source: 'draw line table[p ∈ primes 2..13](p: p, primorial: p#): p -> primorial log y as "p#"' },
];

/** A locked notebook with an editor, an upload, claims and a chart, signed off by one reviewer. */
async function lockedNotebook(): Promise<{ owner: Client; nb: NotebookView; record: LockRecord }> {
  const { client: owner } = await newMember(app, 'record-owner');
  const res = await owner.call('post', '/api/notebooks', { title: 'A triple, recorded', summary: 'Hits of {0, 2, 6}.', tags: ['records'] });
  expectStatus(res, 201);
  const id = res.body.id as string;
  created.push(id);
  await memberWithRole(app, owner, id, 'editor');
  await uploadTriple(owner, id);
  for (const c of CELLS) expectStatus(await owner.call('post', `/api/notebooks/${id}/cells`, c), 201);
  await runAll(owner, id);
  expectStatus(await owner.call('post', `/api/notebooks/${id}/review/request`, {}), 200);
  const { client: reviewer } = await memberWithRole(app, owner, id, 'reviewer');
  await verifyAndSignOff(reviewer, id);
  const locked = await owner.call('post', `/api/notebooks/${id}/lock`);
  expectStatus(locked, 201);
  return { owner, nb: (await owner.call('get', `/api/notebooks/${id}`)).body, record: locked.body };
}

describe('the lock record', () => {
  let owner: Client;
  let nb: NotebookView;
  let record: LockRecord;

  beforeAll(async () => {
    ({ owner, nb, record } = await lockedNotebook());
  }, 180_000);

  it('matches its schema and its own hash, as locked and as read back', async () => {
    expectValid(record);
    expect(record.recordVersion).toBe('cribra-record-v1');
    expect(record.recordSha256).toBe(rehash(record));
    const read: LockRecord = (await owner.call('get', `/api/notebooks/${nb.id}/lock`)).body;
    expect(read).toEqual(record);
    expect(rehash(read)).toBe(record.recordSha256);
    const json = await owner.call('get', `/api/notebooks/${nb.id}/lock/export?format=json`);
    expect(json.text).toBe(`${canonicalJson(record)}\n`);
  });

  it('holds everything a reader needs without the app', () => {
    expect(record).toMatchObject({ title: 'A triple, recorded', summary: 'Hits of {0, 2, 6}.', tags: ['records'], notebookRevision: nb.revision });
    expect(record.authors.map((a) => a.role)).toEqual(['owner', 'editor']);
    expect(record.authors[0]!.id).toBe(nb.owner.id);
    expect(record.cells.map((c) => [c.kind, c.title, c.source])).toEqual(CELLS.map((c) => [c.kind, c.title, c.source]));
    const [note, hits, odd, bound, chart] = record.cells;
    expect(note).toMatchObject({ outputs: null, outputDigest: null, cellRevision: null, claims: [], uploadsRead: [] });
    expect(hits).toMatchObject({ cellRevision: 1, outputsComplete: true, uploadsRead: ['triple'] });
    expect(hits!.outputs).toEqual([expect.objectContaining({ kind: 'value', label: 'hits', text: '640' })]);
    expect(hits!.outputDigest).toBe(nb.cells[1]!.latestRun!.outputDigest);
    expect(odd!.claims).toEqual([expect.objectContaining({
      verdict: 'holds', over: 'p ∈ primes 3..50', binders: [{ name: 'p', domain: 'primes 3..50' }], conditions: [], checked: 14, skipped: 0, counterexample: null,
    })]);
    expect(bound!.claims).toEqual([expect.objectContaining({
      verdict: 'fails',
      binders: [{ name: 'n', domain: '0..50' }],
      conditions: ['n mod 1 = 0'],
      checked: 42,
      counterexample: { binding: [['n', { t: 'int', v: '41' }]], relation: '<', lhs: { t: 'int', v: '1763' }, rhs: { t: 'int', v: '1700' } },
    })]);
    const plot = chart!.outputs![0] as { kind: string; series: Array<{ name: string; points: Array<[number, number]> }> };
    expect(plot.kind).toBe('chart');
    // OEIS A002110: 2, 6, 30, 210, 2310, 30030.
    expect(plot.series[0]!.points).toEqual([[2, 2], [3, 6], [5, 30], [7, 210], [11, 2310], [13, 30030]]);
    expect(record.uploads).toEqual([{
      name: 'triple', originalName: 'triple.txt', kind: 'tuples', mediaType: 'text/plain', sizeBytes: TRIPLE_FILE.length,
      sha256: createHash('sha256').update(TRIPLE_FILE).digest('hex'), rowCount: 3, columns: null, content: { kind: 'tuples', values: ['0', '2', '6'] },
    }]);
    expect(record.signers).toHaveLength(1);
    expect(record.signers[0]).toMatchObject({ revisionDigest: record.revisionDigest, verification: { revisionDigest: record.revisionDigest, cellsRerun: 4, cellsSame: 4 } });
    expect(record.lockedBy.id).toBe(nb.owner.id);
  });

  it('renders the same content as Markdown', async () => {
    const md = (await owner.call('get', `/api/notebooks/${nb.id}/lock/export?format=markdown`)).text;
    for (const text of [
      'Hits of {0, 2, 6}.', record.recordSha256, record.revisionDigest, '### 4. claim cell: A bound that fails',
      'binders: n ∈ 0..50', 'conditions: `n mod 1 = 0`', 'first counterexample: n = 41: left side 1763, right side 1700 (relation < fails)',
      'cases checked: 14', 'Checked over p ∈ primes 3..50 only', 'hits = 640', '| 13 | 30030 |', record.uploads[0]!.sha256,
      `4 of 4 cells the same`, 'cribra verify RECORD.json',
    ]) expect(md).toContain(text);
  });

  it('`cribra verify` on the exported JSON finds every cell the same', async () => {
    const file = join(mkdtempSync(join(tmpdir(), 'cribra-record-')), 'record.json');
    writeFileSync(file, (await owner.call('get', `/api/notebooks/${nb.id}/lock/export?format=json`)).text);
    const r = spawnSync(process.execPath, [CLI, 'verify', file, '--json', '--workers', '1'], { encoding: 'utf8', timeout: 120_000 });
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.counts).toEqual({ same: 4, differs: 0, failed: 0, skipped: 1 });
    expect(out.cells.map((c: { newDigest: string | null }) => c.newDigest)).toEqual(record.cells.map((c) => c.outputDigest));
  });
});

describe('records locked before v1', () => {
  it('read as cribra-record-v0 in the same shape and still pass a lock check', async () => {
    const { owner, nb, record } = await lockedNotebook();
    // The shape the earlier code stored: sources and digests only.
    const old = {
      notebookId: record.notebookId, title: record.title, notebookRevision: record.notebookRevision, revisionDigest: record.revisionDigest,
      digestVersion: record.digestVersion, lockedBy: record.lockedBy, lockedAt: record.lockedAt, requiredSignoffs: record.requiredSignoffs,
      signers: record.signers.map((s) => ({ reviewId: s.reviewId, user: s.user, signedAt: s.signedAt, verificationId: s.verificationId, comment: s.comment })),
      engineVersion: record.engineVersion, languageVersion: record.languageVersion,
      runEngineVersions: record.runEngineVersions, runLanguageVersions: record.runLanguageVersions,
      cells: record.cells.map((c) => ({
        id: c.id, position: c.position, kind: c.kind, sourceSha256: c.sourceSha256, source: c.source, outputDigest: c.outputDigest,
        runId: c.runId, engineVersion: c.engineVersion, languageVersion: c.languageVersion,
      })),
    };
    // As the tables' owner: the maintenance escape of the lock trigger is refused to the app's own role.
    await asOwner(`UPDATE notebook_locks SET record = $2 WHERE notebook_id = $1`, [nb.id, JSON.stringify(old)]);
    const read: LockRecord = (await owner.call('get', `/api/notebooks/${nb.id}/lock`)).body;
    expectValid(read);
    expect(read.recordVersion).toBe('cribra-record-v0');
    expect(read.recordSha256).toBe(rehash(read));
    expect(read.cells.map((c) => [c.source, c.outputDigest, c.title, c.outputs])).toEqual(record.cells.map((c) => [c.source, c.outputDigest, null, null]));
    const md = await owner.call('get', `/api/notebooks/${nb.id}/lock/export?format=markdown`);
    expectStatus(md, 200);
    const check = await owner.call('post', `/api/notebooks/${nb.id}/lock/checks`);
    expectStatus(check, 202);
    const done = await waitVerification(owner, check.body.id);
    expect(done).toMatchObject({ purpose: 'lock', revisionDigest: record.revisionDigest, allSame: true });
  }, 180_000);
});
