// The permission probes: one real request per notebook action (the policy's own table), the
// people who send them (owner, editor, reviewer, viewer, outsider, admin) and the notebooks they
// are sent to. Used by permissions.e2e-spec.ts; hardening tests can reuse them (e.g. to add a probe
// per route). `allowed` is the expected decision, read from the policy's table.
import type { INestApplication } from '@nestjs/common';
import request, { Response } from 'supertest';
import { DataSource } from 'typeorm';
import { CSRF_HEADER, type MemberRole } from '@cribra/contracts';
import { ADMIN_EXCLUDED, MATRIX, type NotebookAction } from '../../src/members/notebook-policy.service';
import { createNotebook, expectStatus, runAll, verifyAndSignOff } from './review-fixtures';
import { Client, newAdmin, newMember, uniqueEmail } from './test-app';

export type Who = MemberRole | 'outsider' | 'admin';
export const WHO: Who[] = ['owner', 'editor', 'reviewer', 'viewer', 'outsider', 'admin'];

export interface Person {
  client: Client;
  id: string;
  email: string;
}

/** Module state, set by `setUpPeople`: the app, its database, the six people, notebooks to delete. */
let app: INestApplication;
let db: DataSource;
export const people = {} as Record<Who, Person>;
export const created: string[] = [];

export async function setUpPeople(theApp: INestApplication): Promise<void> {
  app = theApp;
  db = app.get(DataSource);
  for (const who of WHO) {
    const m = who === 'admin' ? await newAdmin(app) : await newMember(app, who);
    people[who] = { client: m.client, id: m.user.id, email: m.email };
  }
}

/** A notebook with cells (run), a thread, an upload, and editor/reviewer/viewer members. */
export interface Fixture {
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

export async function upload(client: Client, notebookId: string, name: string): Promise<Response> {
  const token = client.csrf ?? (await client.fetchCsrf());
  return request(app.getHttpServer())
    .post(`/api/notebooks/${notebookId}/uploads`)
    .set('Cookie', [...client.jar].map(([k, v]) => `${k}=${v}`).join('; '))
    .set(CSRF_HEADER, token)
    .field('name', name)
    .attach('file', Buffer.from('# a small tuple\n0\n2\n6\n'), 'tuple.txt');
}

export async function fixture(opts: { run?: boolean; locked?: boolean } = {}): Promise<Fixture> {
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
export async function bare(): Promise<Fixture> {
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
export interface Probe {
  ok: number[];
  fresh?: 'bare';
  send(c: Client, f: Fixture, who: Who): Promise<Response>;
}

export const PROBES: Record<NotebookAction, Probe> = {
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
  // A draft's record cannot be published: an allowed person is told it is not locked (409).
  'record.publish': { ok: [409], send: (c, f) => c.call('post', `/api/notebooks/${f.id}/publication`) },
  // Not published: an allowed person learns that (404 after the check).
  'record.read': { ok: [404], send: (c, f) => c.call('get', `/api/notebooks/${f.id}/publication`) },
};

export function allowed(action: NotebookAction, who: Who): boolean {
  if (who === 'admin') return !ADMIN_EXCLUDED.has(action);
  if (who === 'outsider') return false;
  return MATRIX[action].includes(who);
}
