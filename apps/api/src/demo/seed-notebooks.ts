import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { DataSource, EntityManager } from 'typeorm';
import PgBoss from 'pg-boss';
import { evaluate, MemoryDataProvider, parseNotebookFile, type NotebookFile } from '@cribra/lang';
import { LEVELS_SEEDED_UP_TO, type MemberRole, type NotebookStatus } from '@cribra/contracts';
import { isSmallPrime } from '@cribra/engine';
import { freezeNotebook } from '../locks/freeze-notebook';
import { ensureQueues } from '../queue/queue.service';
import { requestLevel } from '../queue/computation-requests';
import { revisionDigest } from '../reviews/revision-digest';
import { kindOf, parseTable, parseTuples } from '../uploads/upload-parser';

/** seeds-demo/notebooks.json */
export interface DemoNotebookManifest {
  notebooks: Array<{
    file: string;
    owner: string;
    members: Array<{ email: string; role: Exclude<MemberRole, 'owner'> }>;
    status: NotebookStatus;
    requiredSignoffs: number;
    signoffs: Array<{ reviewer: string; comment: string }>;
    uploads?: Array<{ name: string; file: string }>;
    /** false: leave the cells unrun (default true). */
    runCells?: boolean;
  }>;
}

/** Runner id recorded on runs computed while loading the demo. */
export const DEMO_RUNNER = 'demo-seed';

function meta(nb: NotebookFile, key: string): string | undefined {
  return nb.meta.find(([k]) => k === key)?.[1];
}

/**
 * Loads the demo notebooks (idempotent: a notebook whose owner already has one with the same title
 * is left alone). Cells come from .sift notebook files; their runs are computed here with Sift's
 * `evaluate` (deterministic, so a later re-verify reproduces the digests); sign-offs bind to the
 * revision digest, and the locked notebook is frozen by the review feature's `freezeNotebook`.
 */
export async function seedDemoNotebooks(ds: DataSource, seedsDir: string, manifest: DemoNotebookManifest): Promise<string[]> {
  const users = new Map<string, string>(
    (await ds.query(`SELECT id, lower(email) AS email FROM users`)).map((u: { id: string; email: string }) => [u.email, u.id]),
  );
  const userId = (email: string): string => {
    const id = users.get(email.toLowerCase());
    if (!id) throw new Error(`demo notebook refers to unknown user ${email}`);
    return id;
  };
  const created: string[] = [];
  for (const spec of manifest.notebooks) {
    const parsed = parseNotebookFile(readFileSync(join(seedsDir, spec.file), 'utf8'));
    if (parsed.errors.length) throw new Error(`${spec.file}: line ${parsed.errors[0].line}: ${parsed.errors[0].message}`);
    const nb = parsed.notebook;
    const title = nb.title ?? spec.file;
    const ownerId = userId(spec.owner);
    const exists = await ds.query(`SELECT 1 FROM notebooks WHERE owner_id = $1 AND title = $2`, [ownerId, title]);
    if (exists.length) continue;
    await ds.transaction((m) => seedOne(m, seedsDir, spec, nb, title, ownerId, userId));
    created.push(title);
  }
  return created;
}

async function seedOne(
  m: EntityManager,
  seedsDir: string,
  spec: DemoNotebookManifest['notebooks'][number],
  nb: NotebookFile,
  title: string,
  ownerId: string,
  userId: (email: string) => string,
): Promise<void> {
  const tags = (meta(nb, 'tags') ?? '').split(',').map((t) => t.trim().toLowerCase()).filter(Boolean);
  const [{ id }] = await m.query(
    `INSERT INTO notebooks (title, summary, tags, owner_id, required_signoffs, revision) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    [title, meta(nb, 'summary') ?? '', tags, ownerId, spec.requiredSignoffs, 1 + nb.cells.length],
  );
  await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, 'owner', $2)`, [id, ownerId]);
  for (const mem of spec.members) {
    await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, $3, $4)`, [id, userId(mem.email), mem.role, ownerId]);
  }
  await m.query(`INSERT INTO audit_events (actor_id, action, notebook_id, details) VALUES ($1, 'notebook.create', $2, $3)`, [
    ownerId,
    id,
    JSON.stringify({ title, demo: true }),
  ]);

  // Uploads first: cells may read them.
  const data = new MemoryDataProvider();
  for (const up of spec.uploads ?? []) {
    const raw = readFileSync(join(seedsDir, up.file));
    const kind = kindOf(up.file);
    const result = kind === 'table' ? parseTable(raw.toString('utf8')) : parseTuples(raw.toString('utf8'));
    if (!kind || !result.ok) throw new Error(`demo upload ${up.file} does not parse`);
    await m.query(
      `INSERT INTO uploads (notebook_id, owner_id, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12)`,
      [id, ownerId, up.name, up.file.split('/').pop(), kind, kind === 'table' ? 'text/csv' : 'text/plain', raw.length,
        createHash('sha256').update(raw).digest('hex'), result.rowCount, result.columns ? JSON.stringify(result.columns) : null,
        JSON.stringify(result.content), raw],
    );
    const c = result.content;
    data.addUpload(up.name, c.kind === 'tuples' ? { kind: 'tuples', values: c.values.map(BigInt) } : c);
  }

  for (const [position, cell] of nb.cells.entries()) {
    const source = cell.source;
    const [{ id: cellId }] = await m.query(
      `INSERT INTO cells (notebook_id, kind, source, position, author_id, title) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
      [id, cell.kind, source, position, ownerId, cell.title],
    );
    if (cell.kind === 'note' || spec.runCells === false) continue;
    const started = new Date();
    const r = evaluate(source, { data });
    const error = r.error ? { kind: r.error.kind, message: r.error.message, ...('line' in r.error && r.error.line ? { line: r.error.line, column: r.error.column } : {}) } : null;
    await m.query(
      `INSERT INTO runs (notebook_id, cell_id, cell_revision, cell_kind, source, status, progress, outputs, output_digest, engine_version,
                         language_version, runner_id, attempts, requested_by, queued_at, started_at, finished_at, duration_ms, error)
       VALUES ($1, $2, 1, $3, $4, $5, 1, $6, $7, $8, $9, $10, 1, $11, $12, $12, now(), $13, $14)`,
      [id, cellId, cell.kind, source, r.ok ? 'succeeded' : 'failed', JSON.stringify(r.outputs), r.ok ? r.digest : null, r.engineVersion,
        r.languageVersion, DEMO_RUNNER, ownerId, started, r.millis, error ? JSON.stringify(error) : null],
    );
  }

  if (spec.signoffs.length) {
    const digest = await revisionDigest(m, id);
    for (const s of spec.signoffs) {
      await m.query(
        `INSERT INTO reviews (notebook_id, reviewer_id, decision, comment, revision_digest, notebook_revision) VALUES ($1, $2, 'signoff', $3, $4, $5)`,
        [id, userId(s.reviewer), s.comment, digest, 1 + nb.cells.length],
      );
    }
  }
  if (spec.status === 'in_review') await m.query(`UPDATE notebooks SET status = 'in_review' WHERE id = $1`, [id]);
  if (spec.status === 'locked') await freezeNotebook(m, id, ownerId);
}

/**
 * Asks the runners for every wheel level up to LEVELS_SEEDED_UP_TO (23#): one computation and
 * plan job per level not yet stored or queued. The first runner to start computes them.
 */
export async function seedStoredLevels(ds: DataSource, databaseUrl: string): Promise<number> {
  const boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', supervise: false, schedule: false, max: 2 });
  boss.on('error', () => undefined);
  await boss.start();
  let created = 0;
  try {
    await ensureQueues(boss);
    for (let p = 2; p <= LEVELS_SEEDED_UP_TO; p++) {
      if (isSmallPrime(p) && (await requestLevel(ds, boss, p, null)).created) created++;
    }
  } finally {
    await boss.stop({ graceful: false, close: true, wait: true });
  }
  return created;
}
