// Fast-check over every request body and query string the API declares (read from its own OpenAPI
// document, so new routes are fuzzed without editing this file): whatever arrives, the answer is a
// clear 4xx in the error shape or a success, never a 500.
import type { INestApplication } from '@nestjs/common';
import fc from 'fast-check';
import request from 'supertest';
import { createNotebook, addCell, addMember, person, type Person } from '../helpers/notebooks';
import { deleteNotebooks } from '../helpers/review-fixtures';
import { newAdmin } from '../helpers/test-app';
import { hostileJson, hostileString } from './hostile-values';

// Forty inputs per body route (fourteen per query-only route): each DTO has at most six fields, and every field meets each
// family of hostile values (injection text, NUL and lone surrogates, huge and fractional numbers,
// wrong types, deep and long arrays, prototype keys) several times over at this count (fast-check's bias towards small and edge values helps); the whole file
// stays within about half a minute on two cores. Raise CRIBRA_FUZZ_RUNS for a longer local session.
const BODY_RUNS = Number(process.env.CRIBRA_FUZZ_RUNS ?? 40);
const QUERY_RUNS = Math.ceil(BODY_RUNS / 3);

interface SchemaObject {
  type?: string;
  enum?: unknown[];
  properties?: Record<string, SchemaObject>;
  items?: SchemaObject;
  $ref?: string;
  maxLength?: number;
}
interface Operation {
  method: string;
  path: string;
  params: Array<{ name: string; in: 'path' | 'query' }>;
  body?: SchemaObject;
  multipart: boolean;
}

// Some DTOs reach the document without properties (validators only); their fields, from the DTO files.
const KNOWN_FIELDS: Record<string, Record<string, SchemaObject>> = {
  SignUpDto: { email: { type: 'string' }, password: { type: 'string' }, displayName: { type: 'string' }, invitationToken: { type: 'string' } },
  SignInDto: { email: { type: 'string' }, password: { type: 'string' } },
  ChangePasswordDto: { currentPassword: { type: 'string' }, newPassword: { type: 'string' } },
  ResetRequestDto: { email: { type: 'string' } },
  ResetConfirmDto: { token: { type: 'string' }, newPassword: { type: 'string' } },
  UpdateRoleDto: { siteRole: { type: 'string', enum: ['admin', 'member'] } },
};

let app: INestApplication;
let admin: Person;
let doc: { paths: Record<string, Record<string, any>>; components: { schemas: Record<string, SchemaObject> } };
const ids: Record<string, string> = {};
const created: string[] = [];

function resolve(s: SchemaObject | undefined): SchemaObject | undefined {
  if (!s?.$ref) return s;
  const name = s.$ref.split('/').pop()!;
  const found = doc.components.schemas[name]!;
  return Object.keys(found.properties ?? {}).length ? found : { type: 'object', properties: KNOWN_FIELDS[name] ?? {} };
}

/** A value the schema would accept, roughly: enum members, short text, small numbers. */
function plausible(s: SchemaObject | undefined): fc.Arbitrary<unknown> {
  const r = resolve(s);
  if (!r) return hostileJson;
  if (r.enum) return fc.constantFrom(...r.enum);
  if (r.properties) return objectOf(r);
  if (r.type === 'array') return fc.array(plausible(r.items), { maxLength: 4 });
  if (r.type === 'number' || r.type === 'integer') return fc.integer({ min: -2, max: 30 });
  if (r.type === 'boolean') return fc.boolean();
  return fc.oneof(fc.constantFrom('wheel', 'x@test.example', '1', '0', ...Object.values(ids)), fc.string({ maxLength: 12 }));
}

function objectOf(schema: SchemaObject): fc.Arbitrary<Record<string, unknown>> {
  const fields = Object.entries(schema.properties ?? {});
  const field = ([name, s]: [string, SchemaObject]) =>
    fc.option(fc.oneof({ weight: 2, arbitrary: plausible(s) }, { weight: 2, arbitrary: hostileJson }), { nil: undefined, freq: 5 }).map((v) => [name, v] as const);
  return fc
    .tuple(fc.tuple(...fields.map(field)), fc.option(fc.tuple(fc.constantFrom('extra', '__proto__', 'id', 'ownerId', 'siteRole'), hostileJson), { freq: 4 }))
    .map(([pairs, extra]) => {
      const o: Record<string, unknown> = {};
      for (const [k, v] of pairs) if (v !== undefined) o[k] = v;
      if (extra) o[extra[0]] = extra[1];
      return o;
    });
}

/** Real ids for the path parameters (so requests reach validation and the service), or garbage. */
function pathValue(path: string, name: string): fc.Arbitrary<string> {
  const seg = path.split('/');
  const owner = seg[seg.indexOf(`{${name}}`) - 1]!;
  const real = name === 'userId' ? ids.member : ids[owner] ?? ids[name];
  const junk = fc.oneof(hostileString.filter((s) => s.length < 2000), fc.constantFrom('00000000-0000-4000-8000-000000000000', '-1', '1e99', '41', '7'));
  return real ? fc.oneof({ weight: 3, arbitrary: fc.constant(real) }, { weight: 1, arbitrary: junk }) : junk;
}

function operations(): Operation[] {
  const out: Operation[] = [];
  for (const [path, ops] of Object.entries(doc.paths)) {
    for (const [method, op] of Object.entries(ops)) {
      const params = (op.parameters ?? []).map((p: { name: string; in: 'path' | 'query' }) => ({ name: p.name, in: p.in }));
      const content = op.requestBody?.content ?? {};
      const multipart = 'multipart/form-data' in content;
      const body = content['application/json']?.schema as SchemaObject | undefined;
      // Only what carries caller data: a body or a query string. Event streams stay open, and
      // parameterless deletes/posts are covered by the permission and feature tests.
      if (path.endsWith('/events')) continue;
      if (!body && !multipart && !params.some((p: { in: string }) => p.in === 'query')) continue;
      out.push({ method, path, params, body, multipart });
    }
  }
  // Routes that could end this client's session or rights go last.
  const late = (o: Operation) => (/\/auth\/|\/admin\//.test(o.path) ? 1 : 0);
  return out.sort((a, b) => late(a) - late(b));
}

/** Percent-encoding of the UTF-8 bytes (a lone surrogate becomes U+FFFD, as in any HTTP client). */
function uriPart(s: string): string {
  return [...Buffer.from(s, 'utf8')].map((b) => (/[A-Za-z0-9_.~-]/.test(String.fromCharCode(b)) ? String.fromCharCode(b) : `%${b.toString(16).padStart(2, '0').toUpperCase()}`)).join('');
}

async function rawJson(method: 'post' | 'put' | 'patch', url: string, text: string) {
  const csrf = admin.client.csrf ?? (await admin.client.fetchCsrf());
  const jar = [...admin.client.jar].map(([k, v]) => `${k}=${v}`).join('; ');
  return request(app.getHttpServer())[method](url).set('Cookie', jar).set('x-csrf-token', csrf).set('Content-Type', 'application/json').send(text);
}

function expectClearAnswer(op: Operation, sent: unknown, res: { status: number; body: any; text: string }): void {
  const where = `${op.method.toUpperCase()} ${op.path} with ${JSON.stringify(sent)?.slice(0, 300)}`;
  if (res.status >= 500) throw new Error(`${where} → ${res.status} ${res.text.slice(0, 300)}`);
  if (res.status >= 400) {
    expect({ where, body: res.body }).toMatchObject({ where, body: { statusCode: res.status, error: expect.any(String), message: expect.any(String) } });
    expect(res.text).not.toMatch(/\n\s+at |QueryFailedError|node_modules/);
  }
}

beforeAll(async () => {
  const { createTestApp } = await import('../helpers/test-app');
  app = await createTestApp();
  doc = (await request(app.getHttpServer()).get('/api/docs-json')).body;
  const a = await newAdmin(app);
  admin = { client: a.client, id: a.user.id, email: a.email };
  const member = await person(app, 'fuzz-member');
  const nb = await createNotebook(admin, { title: 'Fuzz target' });
  created.push(nb.id);
  await addMember(admin, nb.id, member, 'viewer');
  const cell = await addCell(admin, nb.id, 'admissible({0, 2, 6})');
  const thread = await admin.client.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: 'fuzz' });
  const run = await admin.client.call('post', `/api/cells/${cell.id}/runs`);
  Object.assign(ids, {
    notebooks: nb.id, cells: cell.id, threads: thread.body.id, comments: thread.body.comments?.[0]?.id, runs: run.body.id,
    users: member.id, member: member.id,
  });
}, 60_000);

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

describe('fuzzing every DTO', () => {
  it('the OpenAPI document lists the routes with bodies that this test fuzzes', () => {
    const ops = operations();
    const withBody = ops.filter((o) => o.body || o.multipart).map((o) => `${o.method} ${o.path}`);
    expect(withBody.length).toBeGreaterThanOrEqual(20);
    expect(withBody).toEqual(expect.arrayContaining(['post /api/notebooks', 'put /api/cells/{id}', 'post /api/notebooks/{id}/threads', 'post /api/auth/signup']));
  });

  it('answers generated bodies and query strings with 2xx or a clear 4xx, never 5xx', async () => {
    let requests = 0;
    for (const op of operations()) {
      const pathParams = op.params.filter((p) => p.in === 'path');
      const queryParams = op.params.filter((p) => p.in === 'query');
      const input = fc.record({
        path: fc.tuple(...pathParams.map((p) => pathValue(op.path, p.name))),
        query: fc.tuple(...queryParams.map(() => fc.option(fc.oneof(plausible({ type: 'string' }), hostileString.filter((s) => s.length < 4000)), { nil: undefined }))),
        body: op.body ? fc.oneof({ weight: 4, arbitrary: plausible(op.body) }, { weight: 1, arbitrary: hostileJson }) : fc.constant(undefined),
      });
      await fc.assert(
        fc.asyncProperty(input, async ({ path, query, body }) => {
          let url = op.path;
          pathParams.forEach((p, i) => (url = url.replace(`{${p.name}}`, uriPart(path[i]!))));
          const qs = queryParams.map((p, i) => (query[i] === undefined ? '' : `${p.name}=${uriPart(String(query[i]))}`)).filter(Boolean).join('&');
          if (qs) url += `?${qs}`;
          const method = op.method as 'get' | 'post' | 'put' | 'patch' | 'delete';
          let res;
          if (op.multipart) {
            const csrf = admin.client.csrf ?? (await admin.client.fetchCsrf());
            const jar = [...admin.client.jar].map(([k, v]) => `${k}=${v}`).join('; ');
            res = await request(app.getHttpServer()).post(url).set('Cookie', jar).set('x-csrf-token', csrf)
              .field('name', typeof body === 'string' ? body : 'fuzz').attach('file', Buffer.from(String(JSON.stringify(body ?? null))), { filename: 'f.txt', contentType: 'text/plain' });
          } else if (method === 'get' || method === 'delete') {
            res = await admin.client.call(method, url);
          } else {
            // Raw JSON text, so that scalars and arrays arrive as sent (not only objects).
            res = await rawJson(method, url, JSON.stringify(body ?? {}));
          }
          requests++;
          expectClearAnswer(op, { url, body }, res);
        }),
        { numRuns: op.body || op.multipart ? BODY_RUNS : QUERY_RUNS, seed: 8, endOnFailure: true },
      );
    }
    expect(requests).toBeGreaterThan(1000);
  }, 240_000);

  it('answers malformed and oversized raw bodies with 400 or 413', async () => {
    const csrf = await admin.client.fetchCsrf();
    const jar = [...admin.client.jar].map(([k, v]) => `${k}=${v}`).join('; ');
    const raw = (body: string | Buffer, type = 'application/json') =>
      request(app.getHttpServer()).post('/api/notebooks').set('Cookie', jar).set('x-csrf-token', csrf).set('Content-Type', type).send(body);
    for (const body of ['{', '{"title": "x",}', '[', '"just a string"', 'null', '{"title": "\\ud800"}', `{"title": ${'['.repeat(100_000)}`]) {
      const res = await raw(body);
      expect({ body: body.slice(0, 40), status: res.status, text: res.text.slice(0, 200) }).toMatchObject({ status: res.status === 413 ? 413 : 400 });
      expect(res.body).toMatchObject({ statusCode: res.status, message: expect.any(String) });
    }
    const big = await raw(JSON.stringify({ title: 'x', summary: 'y'.repeat(5_000_000) }));
    expect(big.status).toBe(413);
    expect(big.body).toMatchObject({ statusCode: 413, message: expect.any(String) });
    const xml = await raw('<notebook/>', 'application/xml');
    expect(xml.status).toBe(400);
  });
});
