// Locks: only with enough valid sign-offs; the lock record (JSON, Markdown); the API refuses every
// change; the database trigger refuses direct SQL; anyone with access can check it; duplication.
import type { INestApplication } from '@nestjs/common';
import { Client as PgClient } from 'pg';
import { DataSource } from 'typeorm';
import { QUEUES, type LockRecord, type NotebookView } from '@cribra/contracts';
import { QueueService } from '../src/queue/queue.service';
import {
  createNotebook,
  deleteNotebooks,
  expectStatus,
  memberWithRole,
  runAll,
  verifyAndSignOff,
  waitVerification,
} from './helpers/review-fixtures';
import { Client, createTestApp, newAdmin, newMember } from './helpers/test-app';
import { asOwner, sqlFails, sqlStateAsApp } from './helpers/sql-as';

let app: INestApplication;
let db: DataSource;
const created: string[] = [];

beforeAll(async () => {
  app = await createTestApp();
  db = app.get(DataSource);
});

afterAll(async () => {
  await deleteNotebooks(app, created);
  await app.close();
});

/** A notebook in review with `signoffs` reviewers' sign-offs on its current revision. */
async function signedOff(owner: Client, signoffs = 1, required = 1): Promise<{ nb: NotebookView; reviewers: Client[] }> {
  const nb = await createNotebook(owner, 'Admissible 10-tuples of minimal diameter');
  created.push(nb.id);
  if (required !== 1) expectStatus(await owner.call('patch', `/api/notebooks/${nb.id}`, { revision: nb.revision, requiredSignoffs: required }), 200);
  await runAll(owner, nb.id);
  expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/review/request`, {}), 200);
  const reviewers: Client[] = [];
  for (let i = 0; i < signoffs; i++) {
    const { client } = await memberWithRole(app, owner, nb.id, 'reviewer');
    await verifyAndSignOff(client, nb.id);
    reviewers.push(client);
  }
  return { nb: (await owner.call('get', `/api/notebooks/${nb.id}`)).body, reviewers };
}

describe('locking', () => {
  it('needs a review and the required number of valid sign-offs', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const draft = await createNotebook(owner, 'Never reviewed');
    created.push(draft.id);
    const refused = await owner.call('post', `/api/notebooks/${draft.id}/lock`);
    expectStatus(refused, 409);
    expect(refused.body.message).toMatch(/asked for review/);

    const { nb } = await signedOff(owner, 1, 2);
    const one = await owner.call('post', `/api/notebooks/${nb.id}/lock`);
    expectStatus(one, 409);
    expect(one.body.details.blockers.join(' ')).toMatch(/2 valid sign-off\(s\).*there are 1/);
    expect((await owner.call('get', `/api/notebooks/${nb.id}/review`)).body.canLock).toBe(false);
  });

  it('counts only sign-offs of people who are still reviewers', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const { nb } = await signedOff(owner, 1, 1);
    expect((await owner.call('get', `/api/notebooks/${nb.id}/review`)).body.canLock).toBe(true);
    const members = (await owner.call('get', `/api/notebooks/${nb.id}/members`)).body as Array<{ userId: string; role: string }>;
    const reviewerId = members.find((m) => m.role === 'reviewer')!.userId;
    expectStatus(await owner.call('patch', `/api/notebooks/${nb.id}/members/${reviewerId}`, { role: 'viewer' }), 200);
    const state = (await owner.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(state.validSignoffs).toHaveLength(0);
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/lock`), 409);
    const reviews = (await owner.call('get', `/api/notebooks/${nb.id}/reviews`)).body;
    expect(reviews[0]).toMatchObject({ decision: 'signoff', valid: false, voidedAt: null });
    expectStatus(await owner.call('patch', `/api/notebooks/${nb.id}/members/${reviewerId}`, { role: 'reviewer' }), 200);
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/lock`), 201);
  });

  it('an admin who is not a member may lock; an editor or reviewer may not', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const { nb, reviewers } = await signedOff(owner);
    const { client: editor } = await memberWithRole(app, owner, nb.id, 'editor');
    expectStatus(await editor.call('post', `/api/notebooks/${nb.id}/lock`), 403);
    expectStatus(await reviewers[0].call('post', `/api/notebooks/${nb.id}/lock`), 403);
    const { client: admin } = await newAdmin(app);
    const res = await admin.call('post', `/api/notebooks/${nb.id}/lock`);
    expectStatus(res, 201);
    expect((await owner.call('get', `/api/notebooks/${nb.id}`)).body.status).toBe('locked');
  });
});

describe('an edit racing with a lock', () => {
  it('is refused by the trigger and answered 409, not 500', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const nb = await createNotebook(owner, 'Race');
    created.push(nb.id);
    const cell = nb.cells[0];
    // A transaction that locks the notebook row and sets it locked, as a lock does, and commits
    // while the edit (already past the policy check) waits for the row.
    const pg = new PgClient({ connectionString: process.env.DATABASE_URL });
    await pg.connect();
    try {
      await pg.query('BEGIN');
      await pg.query(`UPDATE notebooks SET status = 'locked' WHERE id = $1`, [nb.id]);
      const edit = owner.call('put', `/api/cells/${cell.id}`, { revision: cell.revision, source: 'show 0' });
      await new Promise((r) => setTimeout(r, 400));
      await pg.query('COMMIT');
      const res = await edit;
      expectStatus(res, 409);
      expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: nb.id });
    } finally {
      await pg.end();
    }
    const [{ source }] = await db.query(`SELECT source FROM cells WHERE id = $1`, [cell.id]);
    expect(source).toBe(cell.source);
  });
});

describe('a locked notebook', () => {
  let owner: Client;
  let viewer: Client;
  let nb: NotebookView;
  let record: LockRecord;

  beforeAll(async () => {
    ({ client: owner } = await newMember(app, 'owner'));
    const s = await signedOff(owner, 2, 2);
    nb = s.nb;
    ({ client: viewer } = await memberWithRole(app, owner, nb.id, 'viewer'));
    const res = await owner.call('post', `/api/notebooks/${nb.id}/lock`);
    expectStatus(res, 201);
    record = res.body;
  });

  it('has a lock record with digest, signers and times, engine and language versions', async () => {
    const state = (await owner.call('get', `/api/notebooks/${nb.id}/review`)).body;
    expect(record).toMatchObject({
      notebookId: nb.id,
      notebookRevision: nb.revision,
      revisionDigest: state.revisionDigest,
      digestVersion: 'cribra-revision-v1',
      requiredSignoffs: 2,
    });
    expect(record.signers).toHaveLength(2);
    for (const s of record.signers) expect(Date.parse(s.signedAt)).toBeLessThanOrEqual(Date.parse(record.lockedAt));
    expect(record.engineVersion).toMatch(/^\d+\.\d+\.\d+/);
    expect(record.languageVersion).toMatch(/^\d+\.\d+\.\d+/);
    expect(record.runEngineVersions.length).toBeGreaterThan(0);
    expect(record.cells.map((c) => c.id)).toEqual(nb.cells.map((c) => c.id));
    expect(record.cells.filter((c) => c.outputDigest)).toHaveLength(2);
    expect((await viewer.call('get', `/api/notebooks/${nb.id}/lock`)).body).toEqual(record);
  });

  it('exports the record as JSON and as Markdown saying what was checked and that evidence is not proof', async () => {
    const json = await viewer.call('get', `/api/notebooks/${nb.id}/lock/export?format=json`);
    expectStatus(json, 200);
    expect(json.headers['content-type']).toMatch(/application\/json/);
    expect(json.headers['content-disposition']).toMatch(/attachment; filename="lock-record-.*\.json"/);
    expect(JSON.parse(json.text)).toEqual(record);
    const md = await viewer.call('get', `/api/notebooks/${nb.id}/lock/export?format=markdown`);
    expectStatus(md, 200);
    expect(md.headers['content-type']).toMatch(/text\/markdown/);
    expect(md.text).toContain('Computed evidence is not a proof');
    expect(md.text).toContain('## What was checked');
    expect(md.text).toContain(record.revisionDigest);
    for (const c of nb.cells) expect(md.text).toContain(c.source);
    expectStatus(await viewer.call('get', `/api/notebooks/${nb.id}/lock/export?format=pdf`), 400);
    const audit = (await owner.call('get', `/api/notebooks/${nb.id}/audit`)).body.map((e: { action: string }) => e.action);
    expect(audit).toEqual(expect.arrayContaining(['notebook.lock', 'export.lock_json', 'export.lock_markdown']));
  });

  it('refuses every change through the API with 409 notebook_locked', async () => {
    const cell = nb.cells[0];
    const attempts: Array<[Parameters<Client['call']>[0], string, object?]> = [
      ['put', `/api/cells/${cell.id}`, { revision: cell.revision, source: 'show 0' }],
      ['delete', `/api/cells/${cell.id}?revision=${cell.revision}`],
      ['post', `/api/notebooks/${nb.id}/cells`, { kind: 'note', source: 'late note' }],
      ['put', `/api/notebooks/${nb.id}/cells/order`, { revision: nb.revision, cellIds: nb.cells.map((c) => c.id).reverse() }],
      ['patch', `/api/notebooks/${nb.id}`, { revision: nb.revision, title: 'renamed' }],
      ['delete', `/api/notebooks/${nb.id}`],
      ['post', `/api/cells/${cell.id}/runs`],
      ['post', `/api/notebooks/${nb.id}/runs`],
      ['post', `/api/notebooks/${nb.id}/threads`, { anchor: { kind: 'notebook' }, body: 'late comment' }],
      ['post', `/api/notebooks/${nb.id}/verifications`],
      ['post', `/api/notebooks/${nb.id}/lock`],
    ];
    for (const [method, path, body] of attempts) {
      const res = await owner.call(method, path, body);
      if (res.status !== 409) throw new Error(`${method} ${path}: expected 409, got ${res.status} ${JSON.stringify(res.body)}`);
      expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: nb.id });
    }
    expect((await owner.call('get', `/api/notebooks/${nb.id}`)).body.revision).toBe(nb.revision);
  });

  it('is refused by the database trigger on direct SQL changes', async () => {
    const cell = nb.cells[0];
    const runId = record.cells[0].runId;
    expect(await sqlFails(`UPDATE cells SET source = 'show 0' WHERE id = $1`, [cell.id])).toBe('CRLCK');
    expect(await sqlFails(`DELETE FROM cells WHERE id = $1`, [cell.id])).toBe('CRLCK');
    expect(await sqlFails(`INSERT INTO cells (notebook_id, kind, source, position, author_id) SELECT notebook_id, 'note', 'x', 99, author_id FROM cells WHERE id = $1`, [cell.id])).toBe('CRLCK');
    expect(await sqlFails(`UPDATE runs SET output_digest = $2 WHERE id = $1`, [runId, '0'.repeat(64)])).toBe('CRLCK');
    expect(await sqlFails(`DELETE FROM runs WHERE id = $1`, [runId])).toBe('CRLCK');
    expect(await sqlFails(`UPDATE reviews SET voided_at = now() WHERE notebook_id = $1`, [nb.id])).toBe('CRLCK');
    expect(await sqlFails(`DELETE FROM reviews WHERE notebook_id = $1`, [nb.id])).toBe('CRLCK');
    expect(await sqlFails(`UPDATE notebooks SET title = 'x' WHERE id = $1`, [nb.id])).toBe('CRLCK');
    expect(await sqlFails(`UPDATE notebooks SET status = 'draft' WHERE id = $1`, [nb.id])).toBe('CRLCK');
    expect(await sqlFails(`DELETE FROM notebooks WHERE id = $1`, [nb.id])).toBe('CRLCK');
    expect(await sqlFails(`UPDATE notebook_locks SET revision_digest = $2 WHERE notebook_id = $1`, [nb.id, '0'.repeat(64)])).toBe('CRLCK');
    const [{ source }] = await db.query(`SELECT source FROM cells WHERE id = $1`, [cell.id]);
    expect(source).toBe(cell.source);
  });

  it('can be checked by any member by re-running it against the record', async () => {
    const res = await viewer.call('post', `/api/notebooks/${nb.id}/lock/checks`);
    expectStatus(res, 202);
    const v = await waitVerification(viewer, res.body.id);
    expect(v).toMatchObject({ purpose: 'lock', revisionDigest: record.revisionDigest, allSame: true });
    expect(v.counts).toMatchObject({ same: 2, skipped: 1 });
    // The check left the record and the notebook as they were.
    expect((await owner.call('get', `/api/notebooks/${nb.id}/lock`)).body).toEqual(record);
    expect((await owner.call('get', `/api/notebooks/${nb.id}/review`)).body.revisionDigest).toBe(record.revisionDigest);
  });

  it('duplicates into a new editable draft owned by whoever duplicates it', async () => {
    const res = await viewer.call('post', `/api/notebooks/${nb.id}/duplicate`, {});
    expectStatus(res, 201);
    created.push(res.body.id);
    const copy: NotebookView = (await viewer.call('get', `/api/notebooks/${res.body.id}`)).body;
    expect(copy).toMatchObject({ status: 'draft', myRole: 'owner', title: `${nb.title} (copy)`, requiredSignoffs: 2 });
    expect(copy.cells.map((c) => [c.kind, c.source])).toEqual(nb.cells.map((c) => [c.kind, c.source]));
    expect(copy.cells[0].latestRun?.outputDigest).toBe(record.cells[0].outputDigest);
    const edit = await viewer.call('put', `/api/cells/${copy.cells[0].id}`, { revision: copy.cells[0].revision, source: 'show 5' });
    expectStatus(edit, 200);
    expect((await owner.call('get', `/api/notebooks/${nb.id}`)).body.status).toBe('locked');
  });

  it('only the documented maintenance setting lets teardown delete it', async () => {
    const extra = await signedOff(owner);
    expectStatus(await owner.call('post', `/api/notebooks/${extra.nb.id}/lock`), 201);
    expect(await sqlFails(`DELETE FROM notebooks WHERE id = $1`, [extra.nb.id])).toBe('CRLCK');
    await deleteNotebooks(app, [extra.nb.id]);
    expect(await db.query(`SELECT 1 FROM notebooks WHERE id = $1`, [extra.nb.id])).toHaveLength(0);
  });
});

describe('the database enforces the lock against the app role itself', () => {
  let owner: Client;
  let nb: NotebookView;
  let other: NotebookView;

  beforeAll(async () => {
    ({ client: owner } = await newMember(app, 'owner'));
    nb = (await signedOff(owner)).nb;
    expectStatus(await owner.call('post', `/api/notebooks/${nb.id}/lock`), 201);
    other = await createNotebook(owner, 'An unlocked neighbour');
    created.push(other.id);
  });

  it('the API and runners connect as a role without superuser rights or table ownership', async () => {
    const [me] = await db.query(`SELECT current_user AS name, rolsuper FROM pg_roles WHERE rolname = current_user`);
    expect(me.rolsuper).toBe(false);
    expect(me.name).not.toBe('postgres');
    const [{ n }] = await db.query(`SELECT count(*)::int AS n FROM pg_tables WHERE schemaname = 'public' AND tableowner = current_user`);
    expect(n).toBe(0);
  });

  it('(a) refuses moving a cell of another notebook into the locked one (the new row is checked too)', async () => {
    expect(await sqlStateAsApp([[`UPDATE cells SET notebook_id = $1, position = 77 WHERE id = $2`, [nb.id, other.cells[0].id]]])).toBe('CRLCK');
    const [{ notebook_id }] = await db.query(`SELECT notebook_id FROM cells WHERE id = $1`, [other.cells[0].id]);
    expect(notebook_id).toBe(other.id);
  });

  it('(b) guards uploads of a locked notebook', async () => {
    const [u] = await asOwner<{ id: string }>(
      `INSERT INTO uploads (notebook_id, owner_id, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw)
       SELECT $1, owner_id, 'planted', 'planted.csv', 'table', 'text/csv', 1, repeat('0', 64), 0, '[]', '[]', '' FROM notebooks WHERE id = $1 RETURNING id`,
      [other.id],
    );
    expect(await sqlStateAsApp([[`UPDATE uploads SET notebook_id = $1 WHERE id = $2`, [nb.id, u.id]]])).toBe('CRLCK');
    expect(
      await sqlStateAsApp([[
        `INSERT INTO uploads (notebook_id, owner_id, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw)
         SELECT $1, owner_id, 'late', 'late.csv', 'table', 'text/csv', 1, repeat('0', 64), 0, '[]', '[]', '' FROM notebooks WHERE id = $1`,
        [nb.id],
      ]]),
    ).toBe('CRLCK');
  });

  it('(c) a re-verification run created after the lock cannot be relabelled an ordinary run', async () => {
    const check = await owner.call('post', `/api/notebooks/${nb.id}/lock/checks`);
    expectStatus(check, 202);
    await waitVerification(owner, check.body.id);
    const [run] = await db.query(
      `SELECT r.id FROM runs r JOIN notebook_locks l ON l.notebook_id = r.notebook_id WHERE r.notebook_id = $1 AND r.purpose = 'reverify' AND r.queued_at > l.locked_at LIMIT 1`,
      [nb.id],
    );
    expect(run).toBeDefined();
    expect(await sqlStateAsApp([[`UPDATE runs SET purpose = 'run', outputs = '[]' WHERE id = $1`, [run.id]]])).toBe('CRLCK');
    const [{ purpose }] = await db.query(`SELECT purpose FROM runs WHERE id = $1`, [run.id]);
    expect(purpose).toBe('reverify');
  });

  it('(d) refuses TRUNCATE, session_replication_role = replica and the maintenance setting to the app role', async () => {
    expect(await sqlStateAsApp([[`TRUNCATE cells CASCADE`]])).toMatch(/^(42501|CRLCK)$/);
    expect(await sqlStateAsApp([[`TRUNCATE uploads`]])).toMatch(/^(42501|CRLCK)$/);
    expect(await sqlStateAsApp([[`SET session_replication_role = replica`]])).toBe('42501');
    expect(await sqlStateAsApp([[`ALTER TABLE cells DISABLE TRIGGER cells_guard_locked`]])).toBe('42501');
    expect(
      await sqlStateAsApp([[`BEGIN`], [`SET LOCAL cribra.allow_locked_changes = 'on'`], [`UPDATE cells SET source = 'show 0' WHERE id = $1`, [nb.cells[0].id]]]),
    ).toBe('CRLCK');
    const [{ source }] = await db.query(`SELECT source FROM cells WHERE id = $1`, [nb.cells[0].id]);
    expect(source).toBe(nb.cells[0].source);
  });

  it('a queued run of a notebook locked under it ends failed with the reason, not queued forever', async () => {
    // The state the race used to leave (a run accepted as the lock committed): planted by the owner.
    const [run] = await asOwner<{ id: string; job_id: string }>(
      `INSERT INTO runs (notebook_id, cell_id, cell_revision, cell_kind, source, purpose, requested_by, job_id)
       SELECT notebook_id, id, revision, kind, source, 'run', author_id, gen_random_uuid() FROM cells WHERE id = $1 RETURNING id, job_id`,
      [nb.cells[0].id],
    );
    await app.get(QueueService).send(QUEUES.runCell, { runId: run.id }, { id: run.job_id });
    const until = Date.now() + 30_000;
    let row: { status: string; error: { message: string } | null } | undefined;
    while (Date.now() < until) {
      [row] = await db.query(`SELECT status, error FROM runs WHERE id = $1`, [run.id]);
      if (row && row.status !== 'queued' && row.status !== 'running') break;
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(row?.status).toBe('failed');
    expect(row?.error?.message).toMatch(/locked/);
  }, 40_000);
});

describe('a run sent as the notebook is locked', () => {
  it('waits for the lock and is refused (409), leaving no queued run', async () => {
    const { client: owner } = await newMember(app, 'owner');
    const nb = await createNotebook(owner, 'Run racing a lock');
    created.push(nb.id);
    const cell = nb.cells[0];
    const pg = new PgClient({ connectionString: process.env.DATABASE_URL });
    await pg.connect();
    try {
      // As a lock does: the notebook row FOR UPDATE, set locked, commit while the run waits.
      await pg.query('BEGIN');
      await pg.query(`SELECT id FROM notebooks WHERE id = $1 FOR UPDATE`, [nb.id]);
      await pg.query(`UPDATE notebooks SET status = 'locked' WHERE id = $1`, [nb.id]);
      const run = owner.call('post', `/api/cells/${cell.id}/runs`);
      await new Promise((r) => setTimeout(r, 400));
      await pg.query('COMMIT');
      const res = await run;
      expectStatus(res, 409);
      expect(res.body.details).toEqual({ reason: 'notebook_locked', notebookId: nb.id });
    } finally {
      await pg.end();
    }
    const queued = await db.query(`SELECT id FROM runs WHERE notebook_id = $1 AND status IN ('queued', 'running')`, [nb.id]);
    expect(queued).toHaveLength(0);
  });
});
