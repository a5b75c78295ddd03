import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER, UPLOAD_MAX_BYTES } from '@cribra/contracts';
import { addMember, createNotebook, NO_SUCH_ID, person, type Person } from './helpers/notebooks';
import { createTestApp } from './helpers/test-app';

describe('uploads', () => {
  let app: INestApplication;
  let owner: Person;
  let viewer: Person;
  let outsider: Person;
  let notebookId: string;

  beforeAll(async () => {
    app = await createTestApp();
    [owner, viewer, outsider] = await Promise.all(['uowner', 'uviewer', 'uoutsider'].map((t) => person(app, t)));
    notebookId = (await createNotebook(owner)).id;
    await addMember(owner, notebookId, viewer, 'viewer');
  });
  afterAll(async () => {
    await app.close();
  });

  /** Multipart upload as the given person. */
  async function upload(who: Person, file: Buffer | string, fileName: string, fields: Record<string, string> = {}, type = 'text/plain', nb = notebookId) {
    const token = who.client.csrf ?? (await who.client.fetchCsrf());
    let req = request(app.getHttpServer())
      .post(`/api/notebooks/${nb}/uploads`)
      .set('Cookie', [...who.client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
      .set(CSRF_HEADER, token);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file), { filename: fileName, contentType: type });
  }

  const count = async (): Promise<number> =>
    (await app.get(DataSource).query(`SELECT count(*)::int AS n FROM uploads WHERE notebook_id = $1`, [notebookId]))[0].n;

  it('stores a tuple file: one integer per line with # comments; a cell reads it by name', async () => {
    const res = await upload(owner, '# a narrow 5-tuple\n0\n2\n6\n8  # fourth\n\n12\n', 'quintuple.txt');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'quintuple', kind: 'tuples', rowCount: 5, columns: null, originalName: 'quintuple.txt', owner: { id: owner.id } });
    expect(res.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const content = await viewer.client.call('get', `/api/uploads/${res.body.id}/content`);
    expect(content.body).toEqual({ kind: 'tuples', values: ['0', '2', '6', '8', '12'] });
    expect((await viewer.client.call('get', `/api/notebooks/${notebookId}/uploads`)).body.map((u: { name: string }) => u.name)).toContain('quintuple');
  });

  it('stores a CSV table under a chosen name', async () => {
    const res = await upload(owner, 'level,largest_gap\n13,22\n17,26\n', 'jacobsthal.csv', { name: 'gaps_by_level' }, 'text/csv');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'gaps_by_level', kind: 'table', rowCount: 2, columns: ['level', 'largest_gap'] });
    const csv = await viewer.client.call('get', `/api/uploads/${res.body.id}/export?format=csv`);
    expect(csv.text).toBe('level,largest_gap\r\n13,22\r\n17,26\r\n');
    const json = await viewer.client.call('get', `/api/uploads/${res.body.id}/export?format=json`);
    expect(JSON.parse(json.text)).toEqual([{ level: '13', largest_gap: '22' }, { level: '17', largest_gap: '26' }]);
  });

  it('refuses a file with a bad line, naming the line, and stores nothing', async () => {
    const before = await count();
    const res = await upload(owner, '0\n2\n# fine\nsix\n8\n', 'broken.txt');
    expect(res.status).toBe(400);
    expect(res.body.message).toBe('Line 4: "six" is not an integer (one integer per line; # starts a comment)');
    expect(res.body.details).toEqual({ reason: 'parse_error', errors: [{ line: 4, message: expect.stringContaining('six') }] });
    const csv = await upload(owner, 'a,b\n1,2\n3\n', 'ragged.csv', {}, 'text/csv');
    expect(csv.status).toBe(400);
    expect(csv.body.details.errors[0].line).toBe(3);
    expect(await count()).toBe(before);
  });

  it('refuses wrong types, binary content, oversized files, duplicate and bad names', async () => {
    expect((await upload(owner, 'x', 'sheet.xlsx')).body.details.reason).toBe('bad_type');
    expect((await upload(owner, Buffer.from([0x31, 0x00, 0x32]), 'bin.txt')).body.details.reason).toBe('bad_type');
    expect((await upload(owner, '1\n', 'x.txt', { name: '9lives' })).status).toBe(400);
    expect((await upload(owner, '1\n', 'quintuple.txt')).body.details.reason).toBe('duplicate_name');
    const big = await upload(owner, Buffer.alloc(UPLOAD_MAX_BYTES + 10, '1\n'), 'big.txt');
    expect(big.status).toBe(413);
    const none = await owner.client.call('post', `/api/notebooks/${notebookId}/uploads`, {});
    expect(none.status).toBe(400);
  });

  it('checks rights (403) and existence (404); the owner deletes', async () => {
    expect((await upload(viewer, '1\n', 'v.txt')).status).toBe(403);
    expect((await upload(outsider, '1\n', 'o.txt')).status).toBe(403);
    expect((await upload(owner, '1\n', 'n.txt', {}, 'text/plain', NO_SUCH_ID)).status).toBe(404);
    expect((await outsider.client.call('get', `/api/notebooks/${notebookId}/uploads`)).status).toBe(403);
    expect((await owner.client.call('get', `/api/uploads/${NO_SUCH_ID}`)).status).toBe(404);
    const up = await upload(owner, '5\n', 'temp.txt');
    expect((await viewer.client.call('delete', `/api/uploads/${up.body.id}`)).status).toBe(403);
    expect((await owner.client.call('get', `/api/uploads/${up.body.id}`)).body.name).toBe('temp');
    expect((await owner.client.call('delete', `/api/uploads/${up.body.id}`)).status).toBe(204);
    expect((await owner.client.call('get', `/api/uploads/${up.body.id}`)).status).toBe(404);
  });
});
