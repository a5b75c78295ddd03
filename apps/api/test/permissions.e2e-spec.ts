// The permission matrix, cell by cell: every notebook action (the policy's own table, so a new
// action without a probe here fails) × owner, editor, reviewer, viewer, outsider, admin, through
// HTTP. Then every content-changing action on a locked notebook. docs/permissions.md shows the table.
import type { INestApplication } from '@nestjs/common';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import request, { Response } from 'supertest';
import { CSRF_HEADER, type MemberRole } from '@cribra/contracts';
import { ADMIN_EXCLUDED, CHANGES_CONTENT, MATRIX, NotebookPolicyService, type NotebookAction } from '../src/members/notebook-policy.service';
import { DataSource } from 'typeorm';
import {
  createNotebook,
  deleteNotebooks,
  expectStatus,
  runAll,
  verifyAndSignOff,
} from './helpers/review-fixtures';
import { Client, createTestApp, newAdmin, newMember, uniqueEmail } from './helpers/test-app';

type Who = MemberRole | 'outsider' | 'admin';
const WHO: Who[] = ['owner', 'editor', 'reviewer', 'viewer', 'outsider', 'admin'];

let app: INestApplication;
let db: DataSource;
const people = {} as Record<Who, { client: Client; id: string; email: string }>;
const created: string[] = [];

/** A notebook with cells (run), a thread, an upload, and editor/reviewer/viewer members. */
interface Fixture {
  id: string;
  queryCellId: string;
  runId: string;
  threadId: string;
  uploadId: string;
  locked?: boolean;
}

async function addMembers(notebookId: string): Promise<void> {
  for (const role of ['editor', 'reviewer', 'viewer'] as const) {
    expectStatus(await people.owner.client.call('post', `/api/notebooks/${notebookId}/members`, { email: people[role].email, role }), 201);
  }
}

async function upload(client: Client, notebookId: string, name: string): Promise<Response> {
  const token = client.csrf ?? (await client.fetchCsrf());
  return request(app.getHttpServer())
    .post(`/api/notebooks/${notebookId}/uploads`)
    .set('Cookie', [...client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .field('name', name)
    .attach('file', Buffer.from('# a small tuple\n0\n2\n6\n'), 'tuple.txt');
}

async function fixture(opts: { run?: boolean; locked?: boolean } = {}): Promise<Fixture> {
  const owner = people.owner.client;
  const nb = await createNotebook(owner, 'Permission fixture');
  created.push(nb.id);
  await addMembers(nb.id);
  let runId = '';
  if (opts.run !== false) runId = (await runAll(owner, nb.id))[0].id;
  const thread = await owner.call('post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: 'fixture' });
  expectStatus(thread, 201);
  const up = await upload(owner, nb.id, `u${Date.now().toString(36)}`);
  expectStatus(up, 201);
  if (opts.locked) {
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
    await verifyAndSignOff(people.reviewer.client, nb.id);
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/lock`), 201);
  }
  return { id: nb.id, queryCellId: nb.cells[0].id, runId, threadId: thread.body.id, uploadId: up.body.id, locked: opts.locked };
}

/** A bare notebook for probes that use it up (delete, ask for review). */
async function bare(): Promise<Fixture> {
  const res = await people.owner.client.call('post', '/api/notebooks', { title: 'Bare fixture' });
  expectStatus(res, 201);
  created.push(res.body.id);
  await addMembers(res.body.id);
  return { id: res.body.id, queryCellId: '', runId: '', threadId: '', uploadId: '' };
}

async function cellRevision(cellId: string): Promise<number> {
  return (await db.query(`SELECT revision FROM cells WHERE id = $1`, [cellId]))[0].revision;
}

async function notebookRevision(id: string): Promise<number> {
  return (await db.query(`SELECT revision FROM notebooks WHERE id = $1`, [id]))[0].revision;
}

/**
 * One request per action. `ok`: the statuses an allowed person gets (state-dependent ones
 * such as 409 only where the request is refused after the permission check, never before).
 * `fresh`: the probe needs its own notebook.
 */
interface Probe {
  ok: number[];
  fresh?: 'bare';
  send(c: Client, f: Fixture, who: Who): Promise<Response>;
}

const PROBES: Record<NotebookAction, Probe> = {
  'notebook.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}`) },
  'notebook.update': {
    ok: [200],
    send: async (c, f, who) => c.call('patch', `/api/notebooks/${f.id}`, { revision: await notebookRevision(f.id), summary: `edited by ${who}` }),
  },
  'notebook.delete': { ok: [204], fresh: 'bare', send: (c, f) => c.call('delete', `/api/notebooks/${f.id}`) },
  'members.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/members`) },
  'members.manage': {
    ok: [200],
    send: (c, f) => c.call('patch', `/api/notebooks/${f.id}/members/${people.viewer.id}`, { role: 'viewer' }),
  },
  'cells.edit': {
    ok: [200],
    send: async (c, f, who) => c.call('put', `/api/cells/${f.queryCellId}`, { revision: await cellRevision(f.queryCellId), source: `show 6 * 7 as "${who}"` }),
  },
  'runs.create': { ok: [202], send: (c, f) => c.call('post', `/api/cells/${f.queryCellId}/runs`) },
  // The fixture's run has finished: an allowed person gets "already succeeded".
  'runs.cancel': { ok: [409], send: (c, f) => c.call('post', `/api/runs/${f.runId}/cancel`) },
  'uploads.create': { ok: [201], send: (c, f, who) => upload(c, f.id, `by-${who}-${Date.now().toString(36)}`) },
  'uploads.delete': {
    ok: [204],
    send: async (c, f) => {
      if (f.locked) return c.call('delete', `/api/uploads/${f.uploadId}`); // nothing can be added to it
      const mine = await upload(people.owner.client, f.id, `del-${Date.now().toString(36)}`);
      expectStatus(mine, 201);
      return c.call('delete', `/api/uploads/${mine.body.id}`);
    },
  },
  export: { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/export?format=markdown`) },
  'audit.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/audit`) },
  'invitations.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/invitations`) },
  'invitations.manage': {
    ok: [201],
    send: (c, f) => c.call('post', `/api/notebooks/${f.id}/invitations`, { email: uniqueEmail('matrix'), role: 'viewer' }),
  },
  'comments.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/threads`) },
  'comments.write': { ok: [201], send: (c, f) => c.call('post', `/api/threads/${f.threadId}/comments`, { body: 'probe $x$' }) },
  'comments.resolve': { ok: [200], send: (c, f) => c.call('post', `/api/threads/${f.threadId}/resolve`) },
  'review.read': { ok: [200], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/review`) },
  'review.request': { ok: [200], fresh: 'bare', send: (c, f) => c.call('post', `/api/notebooks/${f.id}/review/request`, {}) },
  'review.verify': { ok: [202], send: (c, f) => c.call('post', `/api/notebooks/${f.id}/verifications`) },
  // The fixture is a draft: an allowed reviewer is told the owner has not asked for review.
  'review.decide': {
    ok: [409],
    send: (c, f) => c.call('post', `/api/notebooks/${f.id}/reviews`, { decision: 'changes_requested', comment: 'probe', revisionDigest: 'f'.repeat(64) }),
  },
  // A draft cannot be locked: an allowed person gets the list of blockers.
  'lock.create': { ok: [409], send: (c, f) => c.call('post', `/api/notebooks/${f.id}/lock`) },
  // Not locked: an allowed person learns that (404 from the lock feature, after the check).
  'lock.read': { ok: [404], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/lock`) },
  'lock.check': { ok: [404], send: (c, f) => c.call('post', `/api/notebooks/${f.id}/lock/checks`) },
  'notebook.duplicate': {
    ok: [201],
    send: async (c, f) => {
      const res = await c.call('post', `/api/notebooks/${f.id}/duplicate`, {});
      if (res.status === 201) created.push(res.body.id);
      return res;
    },
  },
};

function allowed(action: NotebookAction, who: Who): boolean {
  if (who === 'admin') return !ADMIN_EXCLUDED.has(action);
  if (who === 'outsider') return false;
  return MATRIX[action].includes(who);
}

let shared: Fixture;

beforeAll(async () => {
  app = await createTestApp();
  db = app.get(DataSource);
  for (const who of WHO) {
    const m = who === 'admin' ? await newAdmin(app) : await newMember(app, who);
    people[who] = { client: m.client, id: m.user.id, email: m.email };
  }
  shared = await fixture();
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

const ACTIONS = Object.keys(MATRIX) as NotebookAction[];

describe('the policy table', () => {
  it('has a probe for every action', () => {
    expect(Object.keys(PROBES).sort()).toEqual([...ACTIONS].sort());
  });

  it('is the table docs/permissions.md shows', () => {
    const doc = readFileSync(join(__dirname, '../../../docs/permissions.md'), 'utf8');
    const block = doc.slice(doc.indexOf('<!-- permission-matrix:start -->'), doc.indexOf('<!-- permission-matrix:end -->'));
    const rows = block.split('\n').filter((l) => l.startsWith('| `'));
    const shown = rows.map((l) => {
      const cells = l.split('|').map((c) => c.trim());
      return { action: cells[1].replace(/`/g, ''), marks: cells.slice(3, 9), locked: cells[9] };
    });
    expect(shown.map((r) => r.action)).toEqual(ACTIONS);
    for (const r of shown) {
      const action = r.action as NotebookAction;
      expect([action, r.marks]).toEqual([action, WHO.map((who) => (allowed(action, who) ? '✓' : '—'))]);
      expect([action, r.locked.includes('409')]).toEqual([action, CHANGES_CONTENT.has(action)]);
    }
  });

  it('decides every cell as the table says (pure decision)', () => {
    const policy = app.get(NotebookPolicyService);
    for (const action of ACTIONS) {
      for (const who of WHO) {
        const actor = { id: 'x', siteRole: who === 'admin' ? ('admin' as const) : ('member' as const) };
        const role = who === 'admin' || who === 'outsider' ? null : who;
        expect([action, who, policy.can(actor, action, { status: 'draft' }, role)]).toEqual([action, who, allowed(action, who)]);
        if (CHANGES_CONTENT.has(action)) expect(policy.can(actor, action, { status: 'locked' }, role)).toBe(false);
      }
    }
  });
});

describe.each(ACTIONS)('%s', (action) => {
  it.each(WHO)('as %s', async (who) => {
    const probe = PROBES[action];
    const f = probe.fresh ? await bare() : shared;
    const res = await probe.send(people[who].client, f, who);
    const expected = allowed(action, who) ? probe.ok : [403];
    if (!expected.includes(res.status)) {
      throw new Error(`${action} as ${who}: expected ${expected.join(' or ')}, got ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
    }
  });
});

describe('on a locked notebook', () => {
  let locked: Fixture;
  beforeAll(async () => {
    locked = await fixture({ locked: true });
  });

  // Every content-changing action is refused (409 for anyone with access, 403 for others);
  // reading, the lock record, checks and duplication stay as the table says.
  const LOCKED_OK: Partial<Record<NotebookAction, number[]>> = { 'lock.read': [200], 'lock.check': [202] };

  describe.each(ACTIONS)('%s', (action) => {
    it.each(WHO)('as %s', async (who) => {
      const probe = PROBES[action];
      const res = await probe.send(people[who].client, locked, who);
      let expected: number[];
      const hasAccess = who !== 'outsider' && !(who === 'admin' && ADMIN_EXCLUDED.has(action));
      if (CHANGES_CONTENT.has(action)) expected = hasAccess ? [409] : [403];
      else if (!allowed(action, who)) expected = [403];
      else expected = LOCKED_OK[action] ?? probe.ok;
      if (!expected.includes(res.status)) {
        throw new Error(`locked ${action} as ${who}: expected ${expected.join(' or ')}, got ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
      }
      if (res.status === 409) expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: locked.id });
    });
  });
});
