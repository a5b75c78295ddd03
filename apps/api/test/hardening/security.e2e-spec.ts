// Security checks not covered by the feature tests (auth, rate-limit, invitations, password-reset,
// uploads and health cover cookie flags, session regeneration, rate limit, token reuse and expiry,
// oversized and wrong-type uploads, and the CSP): SQL injection through every stored text field,
// script stored verbatim and served inertly, compressed bombs, CSRF tokens across sessions, and
// security headers on every kind of response.
import type { INestApplication } from '@nestjs/common';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER } from '@cribra/contracts';
import { addCell, createNotebook, person, type Person } from '../helpers/notebooks';
import { deleteNotebooks } from '../helpers/review-fixtures';
import { Client, createTestApp, PASSWORD, uniqueEmail } from '../helpers/test-app';
import { SCRIPT_INJECTIONS, SQL_INJECTIONS } from './hostile-values';

let app: INestApplication;
let db: DataSource;
let owner: Person;
let outsider: Person;
const created: string[] = [];

const jarOf = (c: Client) => [...c.jar].map(([k, v]) => `${k}=${v}`).join('; ');

beforeAll(async () => {
  app = await createTestApp();
  db = app.get(DataSource);
  owner = await person(app, 'sec-owner');
  outsider = await person(app, 'sec-outsider');
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('SQL injection through every text field', () => {
  it('stores each payload as written and changes nothing else', async () => {
    const users = Number((await db.query('SELECT count(*) AS n FROM users'))[0].n);
    const tables = Number((await db.query(`SELECT count(*) AS n FROM pg_tables WHERE schemaname = 'public'`))[0].n);
    for (const payload of SQL_INJECTIONS) {
      // Sign-up: display name; notebook: title, summary, tags; cell: source; comment: body;
      // invitation: message; search and tag filters.
      const c = new Client(app);
      const email = uniqueEmail('sqli');
      expect((await c.signUp(email, PASSWORD, payload.slice(0, 100) || 'x')).status).toBe(201);
      expect((await c.call('get', '/api/auth/me')).body.displayName).toBe(payload.slice(0, 100) || 'x');
      const nb = await createNotebook(owner, { title: payload, summary: payload });
      created.push(nb.id);
      expect(nb.title).toBe(payload);
      expect(nb.summary).toBe(payload);
      const cell = await addCell(owner, nb.id, payload, 'note');
      expect(cell.source).toBe(payload);
      const thread = await owner.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: payload });
      expect(thread.status).toBe(201);
      expect(thread.body.comments[0].body).toBe(payload);
      const inv = await owner.client.call('post', `/api/notebooks/${nb.id}/invitations`, { email: uniqueEmail('sqli-inv'), role: 'viewer', message: payload });
      expect(inv.status).toBe(201);
      // Tags accept only letters, digits and # + . _ - (refused otherwise), so the tag filter is probed.
      for (const q of [`q=${encodeURIComponent(payload)}`, `tag=${encodeURIComponent(payload)}`]) {
        const found = await outsider.client.call('get', `/api/notebooks?${q}`);
        expect(found.status).toBeLessThan(500);
        // The outsider sees none of the owner's notebooks, whatever the filter says.
        expect(JSON.stringify(found.body)).not.toContain(nb.id);
      }
      const back = await owner.client.call('get', `/api/notebooks/${nb.id}`);
      expect(back.body).toMatchObject({ title: payload, summary: payload });
    }
    expect(Number((await db.query('SELECT count(*) AS n FROM users'))[0].n)).toBe(users + SQL_INJECTIONS.length);
    expect(Number((await db.query(`SELECT count(*) AS n FROM pg_tables WHERE schemaname = 'public'`))[0].n)).toBe(tables);
    expect((await db.query(`SELECT count(*) AS n FROM users WHERE site_role = 'admin' AND email LIKE 'sqli.%'`))[0].n).toBe('0');
  }, 60_000);

  it('a ledger range or level given as SQL is refused with 400', async () => {
    const ledger = await owner.client.call('post', '/api/ledger/computations', { from: "0'; DROP TABLE ledger_blocks; --", to: '10' });
    expect(ledger.status).toBe(400);
    expect((await owner.client.call('get', `/api/levels/${encodeURIComponent("7 OR 1=1")}`)).status).toBe(400);
    expect((await owner.client.call('get', `/api/notebooks/${encodeURIComponent("x' OR '1'='1")}`)).status).toBe(400);
  });
});

describe('script in notes and comments', () => {
  it('is stored and returned exactly as written, as JSON that browsers will not sniff as HTML', async () => {
    const nb = await createNotebook(owner, { title: SCRIPT_INJECTIONS[0] });
    created.push(nb.id);
    for (const payload of SCRIPT_INJECTIONS) {
      const cell = await addCell(owner, nb.id, `# Note\n\n${payload}`, 'note');
      const read = await owner.client.call('get', `/api/cells/${cell.id}`);
      expect(read.body.source).toBe(`# Note\n\n${payload}`);
      expect(read.headers['content-type']).toMatch(/^application\/json/);
      expect(read.headers['x-content-type-options']).toBe('nosniff');
      const t = await owner.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'cell', cellId: cell.id }, body: payload });
      expect(t.body.comments[0].body).toBe(payload);
    }
    // Exports are downloads, never pages rendered by the browser.
    const md = await owner.client.call('get', `/api/notebooks/${nb.id}/export?format=markdown`);
    expect(md.status).toBe(200);
    expect(md.headers['content-type']).not.toMatch(/html/);
    expect(md.headers['content-disposition']).toMatch(/^attachment/);
  });

  it('an uploaded file is served as a download, not as a page', async () => {
    const nb = await createNotebook(owner, { title: 'Upload served inertly' });
    created.push(nb.id);
    const token = await owner.client.fetchCsrf();
    const up = await request(app.getHttpServer()).post(`/api/notebooks/${nb.id}/uploads`).set('Cookie', jarOf(owner.client)).set(CSRF_HEADER, token)
      .field('name', 'page').attach('file', Buffer.from('h,v\n"<script>alert(1)</script>",1\n'), { filename: 'page.csv', contentType: 'text/csv' });
    expect(up.status).toBe(201);
    const content = await owner.client.call('get', `/api/uploads/${up.body.id}/content`);
    expect(content.status).toBe(200);
    expect(content.headers['content-type']).not.toMatch(/html/);
    expect(content.headers['x-content-type-options']).toBe('nosniff');
    // Declared as HTML by the sender: refused, never stored to be served back as a page.
    const asHtml = await request(app.getHttpServer()).post(`/api/notebooks/${nb.id}/uploads`).set('Cookie', jarOf(owner.client)).set(CSRF_HEADER, token)
      .field('name', 'page2').attach('file', Buffer.from('<html><script>alert(1)</script></html>'), { filename: 'page.html', contentType: 'text/html' });
    expect(asHtml.status).toBe(400);
  });
});

describe('compressed bombs', () => {
  it('a gzip request body that inflates past the limit is refused (413), not inflated into memory', async () => {
    const token = await owner.client.fetchCsrf();
    const inflated = Buffer.alloc(64 * 1024 * 1024, ' ');
    const bomb = gzipSync(Buffer.concat([Buffer.from('{"title":"'), inflated, Buffer.from('"}')]));
    expect(bomb.length).toBeLessThan(200_000);
    const heapBefore = process.memoryUsage().heapUsed;
    // Sent with fetch over a real socket (superagent rewrites compressed request bodies).
    const server = app.getHttpServer();
    if (!server.listening) await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
    const res = await fetch(`http://127.0.0.1:${server.address().port}/api/notebooks`, {
      method: 'POST',
      headers: { Cookie: jarOf(owner.client), [CSRF_HEADER]: token, 'Content-Type': 'application/json', 'Content-Encoding': 'gzip' },
      body: bomb,
    });
    const body = await res.json();
    expect({ status: res.status, body }).toMatchObject({ status: 413, body: { statusCode: 413, message: expect.any(String) } });
    expect(process.memoryUsage().heapUsed - heapBefore).toBeLessThan(48 * 1024 * 1024);
  });

  it('a gzip file or a zip file is refused as an upload type', async () => {
    const nb = await createNotebook(owner, { title: 'Bomb uploads' });
    created.push(nb.id);
    const token = await owner.client.fetchCsrf();
    const gz = gzipSync(Buffer.alloc(32 * 1024 * 1024, '1\n'));
    for (const [filename, contentType] of [['tuple.txt.gz', 'application/gzip'], ['tuple.txt', 'application/gzip'], ['tuples.zip', 'application/zip']] as const) {
      const res = await request(app.getHttpServer()).post(`/api/notebooks/${nb.id}/uploads`).set('Cookie', jarOf(owner.client)).set(CSRF_HEADER, token)
        .field('name', 'bomb').attach('file', gz, { filename, contentType });
      expect({ filename, status: res.status }).toEqual({ filename, status: 400 });
      expect(res.body.details?.reason).toBe('bad_type');
    }
  });
});

describe('CSRF and sessions', () => {
  it('a token taken from another session is refused (403)', async () => {
    const a = await person(app, 'csrf-a');
    const b = await person(app, 'csrf-b');
    const tokenOfA = await a.client.fetchCsrf();
    await b.client.fetchCsrf();
    const res = await b.client.call('post', '/api/notebooks', { title: 'forged' }, { csrf: tokenOfA });
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({ statusCode: 403 });
  });

  it('a made-up or tampered session cookie signs no one in', async () => {
    const sid = owner.client.cookie('cribra.sid')!;
    for (const forged of ['s%3Aattacker-chosen-id.AAAA', sid.replace(/.$/, (ch) => (ch === 'A' ? 'B' : 'A')), 'attacker-chosen-id']) {
      const res = await request(app.getHttpServer()).get('/api/auth/me').set('Cookie', `cribra.sid=${forged}`);
      expect(res.status).toBe(401);
    }
  });

  it('signing out ends the session on the server: the old cookie no longer works', async () => {
    const p = await person(app, 'signout');
    const old = p.client.cookie('cribra.sid')!;
    expect((await p.client.call('post', '/api/auth/signout')).status).toBe(204);
    expect((await request(app.getHttpServer()).get('/api/auth/me').set('Cookie', `cribra.sid=${old}`)).status).toBe(401);
  });
});

describe('security headers on every kind of response', () => {
  it.each([
    ['an API answer', 'get', '/api/health'],
    ['an error', 'get', '/api/no-such-route'],
    ['a refusal', 'post', '/api/notebooks'],
  ] as const)('%s', async (_what, method, path) => {
    const res = await request(app.getHttpServer())[method](path);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(res.headers['x-frame-options']).toBeDefined();
    expect(res.headers['referrer-policy']).toBeDefined();
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.text).not.toMatch(/\n\s+at /);
  });
});
