import type { DataSource, EntityManager } from 'typeorm';
import type { CellView } from '@cribra/contracts';
import { latestRunsByCell } from '../runs/run-views';

interface CellRow {
  id: string;
  notebook_id: string;
  kind: CellView['kind'];
  title: string | null;
  source: string;
  position: number;
  revision: number;
  author_id: string;
  author_name: string;
  created_at: Date;
  updated_at: Date;
}

const SELECT_CELL = `
  SELECT c.id, c.notebook_id, c.kind, c.title, c.source, c.position, c.revision, c.author_id,
         u.display_name AS author_name, c.created_at, c.updated_at
    FROM cells c JOIN users u ON u.id = c.author_id`;

type Db = DataSource | EntityManager;

/** `inlineOutputsUpTo`: leave out outputs stored larger than this (a notebook read's summary). */
export interface CellViewOptions {
  inlineOutputsUpTo?: number;
}

async function withRuns(db: Db, rows: CellRow[], opts: CellViewOptions = {}): Promise<CellView[]> {
  const latest = await latestRunsByCell(
    db,
    rows.map((r) => r.id),
    opts,
  );
  return rows.map((r) => ({
    id: r.id,
    notebookId: r.notebook_id,
    kind: r.kind,
    title: r.title,
    source: r.source,
    position: r.position,
    revision: r.revision,
    author: { id: r.author_id, displayName: r.author_name },
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
    latestRun: latest.get(r.id) ?? null,
  }));
}

/** Every cell of a notebook in order, each with its latest run. */
export async function loadNotebookCells(db: Db, notebookId: string, opts: CellViewOptions = {}): Promise<CellView[]> {
  const rows: CellRow[] = await db.query(`${SELECT_CELL} WHERE c.notebook_id = $1 ORDER BY c.position`, [notebookId]);
  return withRuns(db, rows, opts);
}

export async function loadCell(db: Db, id: string): Promise<CellView | null> {
  const rows: CellRow[] = await db.query(`${SELECT_CELL} WHERE c.id = $1`, [id]);
  return rows.length ? (await withRuns(db, rows))[0] : null;
}
