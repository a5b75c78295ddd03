// Hardening, round two (issue 19): the small findings — paging parameters out of range, CSV
// exports that a spreadsheet would execute, and tuple uploads with a repeated value.
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER, NOTEBOOK_INLINE_OUTPUT_BYTES, RUN_OUTPUT_MAX_BYTES, type NotebookView, type RunView } from '@cribra/contracts';
import { addCell, createNotebook, person, type Person } from '../helpers/notebooks';
import { deleteNotebooks, waitRun } from '../helpers/review-fixtures';
import { createTestApp } from '../helpers/test-app';

let app: INestApplication;
let owner: Person;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
  owner = await person(app, 'r2-owner');
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('paging parameters', () => {
  it('answers 400 naming the field for a page past the limit, on every paged list (was 500 "bigint out of range")', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const cell = await addCell(owner, nb.id, 'show 1');
    for (const path of ['/api/notebooks', '/api/ledger/blocks', `/api/notebooks/${nb.id}/runs`, `/api/cells/${cell.id}/runs`]) {
      for (const page of ['1e20', '99999999999', '1000001']) {
        const res = await owner.client.call('get', `${path}?page=${page}`);
        if (res.status !== 400) throw new Error(`${path}?page=${page}: expected 400, got ${res.status} ${JSON.stringify(res.body)}`);
        expect(res.body.details).toEqual([expect.objectContaining({ field: 'page' })]);
      }
      const big = await owner.client.call('get', `${path}?pageSize=1e20`);
      expect(big.status).toBe(400);
    }
    expect((await owner.client.call('get', '/api/notebooks?page=1000000')).status).toBe(200);
  });
});

/** Multipart upload as the owner. */
async function upload(nb: string, file: string, fileName: string, type = 'text/plain') {
  const token = owner.client.csrf ?? (await owner.client.fetchCsrf());
  return request(app.getHttpServer())
    .post(`/api/notebooks/${nb}/uploads`)
    .set('Cookie', [...owner.client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .attach('file', Buffer.from(file), { filename: fileName, contentType: type });
}

describe('uploads', () => {
  it('refuses a tuple file with a repeated value at upload, naming the lines of both occurrences; nothing is stored', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const res = await upload(nb.id, '# a 5-tuple with a slip\n0\n2\n6\n8\n2\n', 'slip.txt');
    expect(res.status).toBe(400);
    expect(res.body.message).toBe('Line 6: 2 appears on lines 3 and 6 (the values of a tuple are distinct)');
    expect(res.body.details).toMatchObject({ reason: 'parse_error', errors: [{ line: 6, message: expect.stringContaining('lines 3 and 6') }] });
    const [{ n }] = await app.get(DataSource).query(`SELECT count(*)::int AS n FROM uploads WHERE notebook_id = $1`, [nb.id]);
    expect(n).toBe(0);
  });

  it('exports an uploaded table to CSV with formula-leading fields neutralised (a leading quote)', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const res = await upload(nb.id, 'p,note\n5,"=HYPERLINK(""http://x"")"\n-7,@SUM(A1)\n11,+1+1\n', 'evil.csv', 'text/csv');
    expect(res.status).toBe(201);
    const csv = await owner.client.call('get', `/api/uploads/${res.body.id}/export?format=csv`);
    expect(csv.status).toBe(200);
    expect(csv.text).toBe(`p,note\r\n5,"'=HYPERLINK(""http://x"")"\r\n-7,'@SUM(A1)\r\n11,'+1+1\r\n`);
  });
});

describe('bounded outputs', () => {
  /** A 262 000-bit value has 78 870 digits; each shown value stores its digits twice (value and text). */
  const huge = (count: number) => `let x = 2^262000\nshow [x + n : n ∈ 1..${count}]`;

  it('fails a run whose outputs exceed the per-run byte limit with a limit error naming both sizes; nothing of them is stored', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const cell = await addCell(owner, nb.id, huge(40));
    const queued = await owner.client.call('post', `/api/cells/${cell.id}/runs`);
    expect(queued.status).toBe(202);
    const run = await waitRun(owner.client, queued.body.id, 90_000);
    expect(run.status).toBe('failed');
    expect(run.error).toMatchObject({ kind: 'limit', limit: { name: 'run_output_bytes', maxBytes: RUN_OUTPUT_MAX_BYTES } });
    const size = run.error!.limit!.sizeBytes;
    expect(size).toBeGreaterThan(RUN_OUTPUT_MAX_BYTES);
    expect(run.error!.message).toContain(`${size} bytes, above the limit of ${RUN_OUTPUT_MAX_BYTES} bytes per run`);
    expect(run.outputs).toEqual([]);
  }, 120_000);

  it('a notebook read leaves out a heavy run\'s outputs (fetched per run), so its size stays small', async () => {
    const nb = await createNotebook(owner);
    created.push(nb.id);
    const heavy = await addCell(owner, nb.id, huge(6));
    const light = await addCell(owner, nb.id, 'show 2^61 - 1');
    for (const c of [heavy, light]) {
      const q = await owner.client.call('post', `/api/cells/${c.id}/runs`);
      expect((await waitRun(owner.client, q.body.id, 90_000)).status).toBe('succeeded');
    }
    const read = await owner.client.call('get', `/api/notebooks/${nb.id}`);
    expect(read.status).toBe(200);
    const view = read.body as NotebookView;
    const [h, l] = [view.cells.find((c) => c.id === heavy.id)!, view.cells.find((c) => c.id === light.id)!];
    expect(h.latestRun).toMatchObject({ outputs: null, outputsOmitted: true, status: 'succeeded' });
    expect(h.latestRun!.outputDigest).toMatch(/^[0-9a-f]{64}$/);
    // 2^61 − 1 = 2305843009213693951, a Mersenne prime (OEIS A000668)
    expect(l.latestRun!.outputs).toEqual([expect.objectContaining({ text: '2305843009213693951' })]);
    expect(l.latestRun!.outputsOmitted).toBeUndefined();
    expect(read.text.length).toBeLessThan(NOTEBOOK_INLINE_OUTPUT_BYTES);
    const full = (await owner.client.call('get', `/api/runs/${h.latestRun!.id}`)).body as RunView;
    expect(full.outputs).toHaveLength(1); // one series of six values
    expect(JSON.stringify(full.outputs).length).toBeGreaterThan(6 * 78_000);
  }, 180_000);
});
