import type { DataSource, EntityManager } from 'typeorm';
import type { ComputationView } from '@cribra/contracts';

interface ComputationRow {
  id: string;
  kind: ComputationView['kind'];
  params: ComputationView['params'];
  status: ComputationView['status'];
  chunks_total: number;
  chunks_done: number;
  requested_by: string | null;
  requested_by_name: string | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  error: string | null;
}

const SELECT = `
  SELECT c.id, c.kind, c.params, c.status, c.chunks_total, c.chunks_done, c.requested_by,
         u.display_name AS requested_by_name, c.created_at, c.started_at, c.finished_at, c.error
    FROM computations c LEFT JOIN users u ON u.id = c.requested_by`;

const toView = (r: ComputationRow): ComputationView => ({
  id: r.id,
  kind: r.kind,
  params: r.params,
  status: r.status,
  chunksTotal: r.chunks_total,
  chunksDone: r.chunks_done,
  requestedBy: r.requested_by ? { id: r.requested_by, displayName: r.requested_by_name ?? '' } : null,
  createdAt: new Date(r.created_at).toISOString(),
  startedAt: r.started_at ? new Date(r.started_at).toISOString() : null,
  finishedAt: r.finished_at ? new Date(r.finished_at).toISOString() : null,
  error: r.error,
});

type Db = DataSource | EntityManager;

export async function loadComputation(db: Db, id: string): Promise<ComputationView | null> {
  const rows: ComputationRow[] = await db.query(`${SELECT} WHERE c.id = $1`, [id]);
  return rows.length ? toView(rows[0]) : null;
}

export async function listComputations(db: Db, kind?: string, status?: string, limit = 100): Promise<ComputationView[]> {
  const rows: ComputationRow[] = await db.query(
    `${SELECT} WHERE ($1::text IS NULL OR c.kind = $1) AND ($2::text IS NULL OR c.status = $2)
      ORDER BY c.created_at DESC LIMIT $3`,
    [kind ?? null, status ?? null, limit],
  );
  return rows.map(toView);
}
