import type { DataSource, EntityManager } from 'typeorm';
import type { RunView } from '@cribra/contracts';

/** Columns of a run joined with its requester's name, as RunView needs them. */
export const SELECT_RUN_COLUMNS = `
  SELECT r.id, r.notebook_id, r.cell_id, r.cell_revision, r.purpose, r.status, r.progress, r.progress_note,
         r.outputs, r.output_digest, r.engine_version, r.language_version, r.runner_id, r.attempts,
         r.requested_by, u.display_name AS requested_by_name, r.queued_at, r.started_at, r.finished_at,
         r.duration_ms, r.error`;
const SELECT_RUN = `${SELECT_RUN_COLUMNS}
    FROM runs r JOIN users u ON u.id = r.requested_by`;

export interface RunRow {
  id: string;
  notebook_id: string;
  cell_id: string;
  cell_revision: number;
  purpose: RunView['purpose'];
  status: RunView['status'];
  progress: number;
  progress_note: string | null;
  outputs: RunView['outputs'];
  output_digest: string | null;
  engine_version: string | null;
  language_version: string | null;
  runner_id: string | null;
  attempts: number;
  requested_by: string;
  requested_by_name: string;
  queued_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  duration_ms: number | null;
  error: RunView['error'];
  /** Only in summary reads (latestRunsByCell with inlineOutputsUpTo). */
  outputs_omitted?: boolean;
}

const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

export function toRunView(r: RunRow): RunView {
  return {
    id: r.id,
    notebookId: r.notebook_id,
    cellId: r.cell_id,
    cellRevision: r.cell_revision,
    purpose: r.purpose,
    status: r.status,
    progress: Number(r.progress),
    progressNote: r.progress_note,
    outputs: r.outputs,
    outputDigest: r.output_digest,
    engineVersion: r.engine_version,
    languageVersion: r.language_version,
    runnerId: r.runner_id,
    attempts: r.attempts,
    requestedBy: { id: r.requested_by, displayName: r.requested_by_name },
    queuedAt: new Date(r.queued_at).toISOString(),
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    durationMs: r.duration_ms,
    error: r.error,
    ...(r.outputs_omitted ? { outputsOmitted: true } : {}),
  };
}

type Db = DataSource | EntityManager;

export async function loadRun(db: Db, id: string): Promise<RunView | null> {
  const rows: RunRow[] = await db.query(`${SELECT_RUN} WHERE r.id = $1`, [id]);
  return rows.length ? toRunView(rows[0]) : null;
}

export async function loadRuns(db: Db, ids: string[]): Promise<RunView[]> {
  if (!ids.length) return [];
  const rows: RunRow[] = await db.query(`${SELECT_RUN} WHERE r.id = ANY($1::uuid[])`, [ids]);
  const byId = new Map(rows.map((r) => [r.id, toRunView(r)]));
  return ids.map((id) => byId.get(id)).filter((v): v is RunView => !!v);
}

/** One page of runs of a cell or a notebook, newest first. */
export async function pageRuns(
  db: Db,
  column: 'cell_id' | 'notebook_id',
  id: string,
  page: number,
  pageSize: number,
): Promise<{ items: RunView[]; total: number }> {
  const rows: RunRow[] = await db.query(`${SELECT_RUN} WHERE r.${column} = $1 ORDER BY r.queued_at DESC, r.id LIMIT $2 OFFSET $3`, [
    id,
    pageSize,
    (page - 1) * pageSize,
  ]);
  const [{ n }] = await db.query(`SELECT count(*)::int AS n FROM runs WHERE ${column} = $1`, [id]);
  return { items: rows.map(toRunView), total: n };
}

/**
 * The latest ordinary run of each given cell (any revision); re-verify runs never replace what a cell shows.
 * With `inlineOutputsUpTo`, outputs stored larger than that many bytes are left out (`outputsOmitted`):
 * `pg_column_size` reads the stored size without fetching the value, so a heavy run costs nothing here.
 */
export async function latestRunsByCell(db: Db, cellIds: string[], opts: { inlineOutputsUpTo?: number } = {}): Promise<Map<string, RunView>> {
  if (!cellIds.length) return new Map();
  const limit = opts.inlineOutputsUpTo;
  const select =
    limit === undefined
      ? SELECT_RUN
      : `${SELECT_RUN_COLUMNS.replace('r.outputs,', `CASE WHEN pg_column_size(r.outputs) <= ${Math.floor(limit)} THEN r.outputs END AS outputs,
         coalesce(pg_column_size(r.outputs) > ${Math.floor(limit)}, false) AS outputs_omitted,`)}
    FROM runs r JOIN users u ON u.id = r.requested_by`;
  const rows: RunRow[] = await db.query(
    `${select} WHERE r.id IN (SELECT DISTINCT ON (cell_id) id FROM runs WHERE cell_id = ANY($1::uuid[]) AND purpose = 'run'
                      ORDER BY cell_id, queued_at DESC, id)`,
    [cellIds],
  );
  return new Map(rows.map((r) => [r.cell_id, toRunView(r)]));
}
