import { randomUUID } from 'node:crypto';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { QUEUES, type Page, type RunCellJob, type RunProgressEvent, type RunPurpose, type RunStatus, type RunView } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { QueueService } from '../queue/queue.service';
import { assertRunnable } from './syntax-check';
import { SELECT_RUN_COLUMNS, loadRun, loadRuns, pageRuns, toRunView, type RunRow } from './run-views';

/** A cells row as runCell reads it. */
export interface CellToRun {
  id: string;
  notebook_id: string;
  kind: string;
  source: string;
  revision: number;
}

/** Creates runs (a row plus a pg-boss job each), cancels them and reads their history. */
@Injectable()
export class RunsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly queue: QueueService,
    private readonly audit: AuditService,
  ) {}

  async get(id: string): Promise<RunView> {
    const run = await loadRun(this.db, id);
    if (!run) throw new NotFoundException('Run not found');
    return run;
  }

  async notebookOfRun(id: string): Promise<string> {
    const rows: Array<{ notebook_id: string }> = await this.db.query(`SELECT notebook_id FROM runs WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Run not found');
    return rows[0].notebook_id;
  }

  /** The run's state in the shape of its notifications (the runs table's trigger sends the same fields). */
  async progressOf(id: string): Promise<RunProgressEvent> {
    const rows: Array<{ id: string; notebook_id: string; cell_id: string; status: RunStatus; progress: number; progress_note: string | null; output_digest: string | null }> =
      await this.db.query(`SELECT id, notebook_id, cell_id, status, progress, progress_note, output_digest FROM runs WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Run not found');
    const r = rows[0];
    return { id: r.id, notebookId: r.notebook_id, cellId: r.cell_id, status: r.status, progress: Number(r.progress), progressNote: r.progress_note, outputDigest: r.output_digest };
  }

  /** The cell as a run needs it (404 if unknown); the controller passes it on to runCell. */
  async cellToRun(cellId: string): Promise<CellToRun> {
    const cells: CellToRun[] = await this.db.query(`SELECT id, notebook_id, kind, source, revision FROM cells WHERE id = $1`, [cellId]);
    if (!cells.length) throw new NotFoundException('Cell not found');
    return cells[0];
  }

  /**
   * Queues a run of the cell's current revision. `purpose` 'reverify' is for the review feature.
   * Note cells have nothing to execute (400).
   */
  async runCell(actor: Actor, cellId: string, purpose: RunPurpose = 'run', loaded?: CellToRun): Promise<RunView> {
    const cell = loaded ?? (await this.cellToRun(cellId));
    if (cell.kind === 'note') {
      throw new BadRequestException({ message: 'Note cells have nothing to run', details: [{ field: 'kind', messages: ['a note cell cannot run'] }] });
    }
    // The job id is chosen here, so the run row is stored complete in one statement (which also
    // returns the view) and pg-boss is told the id: three round trips fewer than insert, send,
    // update, re-read. The runner only sees the run once the job exists.
    const jobId = randomUUID();
    // Fairness between people: each run a person already has waiting or running lowers the
    // priority of their next one, so one person's flood of runs cannot hold back another
    // person's single run (pg-boss serves higher priorities first, then oldest first).
    const [{ active }]: Array<{ active: number }> = await this.db.query(
      `SELECT count(*)::int AS active FROM runs WHERE requested_by = $1 AND status IN ('queued', 'running')`,
      [actor.id],
    );
    const [row]: RunRow[] = await this.db.query(
      `WITH r AS (
         INSERT INTO runs (notebook_id, cell_id, cell_revision, cell_kind, source, purpose, requested_by, job_id)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING *)
       ${SELECT_RUN_COLUMNS} FROM r JOIN users u ON u.id = r.requested_by`,
      [cell.notebook_id, cell.id, cell.revision, cell.kind, cell.source, purpose, actor.id, jobId],
    );
    try {
      const job: RunCellJob = { runId: row.id };
      await this.queue.send(QUEUES.runCell, job, { id: jobId, priority: -active });
    } catch (err) {
      await this.db.query(
        `UPDATE runs SET status = 'failed', finished_at = now(), error = $2 WHERE id = $1`,
        [row.id, JSON.stringify({ kind: 'internal', message: 'The run could not be queued' })],
      );
      throw err;
    }
    return toRunView(row);
  }

  /** Queues every query and claim cell of the notebook, top to bottom; none when a cell does not parse (400). */
  async runAll(actor: Actor, notebookId: string, purpose: RunPurpose = 'run'): Promise<RunView[]> {
    const cells: Array<{ id: string; source: string; position: number }> = await this.db.query(
      `SELECT id, source, position FROM cells WHERE notebook_id = $1 AND kind <> 'note' ORDER BY position`,
      [notebookId],
    );
    assertRunnable(cells.map((c) => ({ source: c.source, where: `cell ${c.position + 1}` })));
    const ids: string[] = [];
    for (const c of cells) ids.push((await this.runCell(actor, c.id, purpose)).id);
    return loadRuns(this.db, ids);
  }

  /** Cancels a queued or running run; a runner notices within a second and stops. */
  async cancel(actor: Actor, id: string): Promise<RunView> {
    const [rows] = await this.db.query(
      `UPDATE runs SET status = 'cancelled', finished_at = now(),
              duration_ms = CASE WHEN started_at IS NULL THEN NULL ELSE (extract(epoch FROM now() - started_at) * 1000)::int END,
              error = $2
        WHERE id = $1 AND status IN ('queued', 'running') RETURNING job_id, notebook_id`,
      [id, JSON.stringify({ kind: 'cancelled', message: 'Cancelled by a member' })],
    );
    if (!rows.length) {
      const run = await this.get(id);
      throw new ConflictException({ message: `The run already ${run.status}`, details: { status: run.status } });
    }
    if (rows[0].job_id) await this.queue.cancel(QUEUES.runCell, rows[0].job_id).catch(() => undefined);
    await this.audit.record(actor.id, 'run.cancel', rows[0].notebook_id, { runId: id });
    return this.get(id);
  }

  async history(column: 'cell_id' | 'notebook_id', id: string, page = 1, pageSize = 20): Promise<Page<RunView>> {
    const { items, total } = await pageRuns(this.db, column, id, page, pageSize);
    return { items, total, page, pageSize };
  }
}
