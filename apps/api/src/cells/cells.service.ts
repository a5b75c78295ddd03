import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import type { CellView, StaleCellDetails, StaleOrderDetails } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { loadCell, loadNotebookCells } from './cell-views';
import { CreateCellDto } from './dto/create-cell.dto';
import { ReorderCellsDto } from './dto/reorder-cells.dto';
import { UpdateCellDto } from './dto/update-cell.dto';

/** A title as stored: trimmed, null when blank. */
export const cellTitle = (t: string | null | undefined): string | null => (t && t.trim() ? t.trim() : null);

/**
 * Cells with optimistic concurrency. Every change also bumps the notebook revision in the same
 * transaction (the review feature's revision digest and sign-offs depend on it).
 */
@Injectable()
export class CellsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly audit: AuditService,
  ) {}

  /** The notebook a cell belongs to (404 when the cell does not exist). */
  async notebookOf(cellId: string): Promise<string> {
    const rows: Array<{ notebook_id: string }> = await this.db.query(`SELECT notebook_id FROM cells WHERE id = $1`, [cellId]);
    if (!rows.length) throw new NotFoundException('Cell not found');
    return rows[0].notebook_id;
  }

  async get(id: string): Promise<CellView> {
    const cell = await loadCell(this.db, id);
    if (!cell) throw new NotFoundException('Cell not found');
    return cell;
  }

  list(notebookId: string): Promise<CellView[]> {
    return loadNotebookCells(this.db, notebookId);
  }

  private async bumpNotebook(m: EntityManager, notebookId: string): Promise<number> {
    const [rows] = await m.query(
      `UPDATE notebooks SET revision = revision + 1, updated_at = now() WHERE id = $1 RETURNING revision`,
      [notebookId],
    );
    return rows[0].revision;
  }

  private async stale(id: string, from: number): Promise<never> {
    const current = await this.get(id);
    const details: StaleCellDetails = { reason: 'stale_revision', current };
    throw new ConflictException({
      message: `The cell changed since revision ${from} (now ${current.revision}); merge with the current text and retry`,
      details,
    });
  }

  async create(actor: Actor, notebookId: string, body: CreateCellDto): Promise<CellView> {
    const id = await this.db.transaction(async (m) => {
      // Serialise structural changes of one notebook.
      await m.query(`SELECT id FROM notebooks WHERE id = $1 FOR UPDATE`, [notebookId]);
      const [{ n }] = await m.query(`SELECT count(*)::int AS n FROM cells WHERE notebook_id = $1`, [notebookId]);
      const position = body.position === undefined ? n : Math.min(body.position, n);
      await m.query(`UPDATE cells SET position = position + 1 WHERE notebook_id = $1 AND position >= $2`, [notebookId, position]);
      const [{ id }] = await m.query(
        `INSERT INTO cells (notebook_id, kind, source, position, author_id, title) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
        [notebookId, body.kind, body.source, position, actor.id, cellTitle(body.title)],
      );
      await this.bumpNotebook(m, notebookId);
      await this.audit.record(actor.id, 'cell.create', notebookId, { cellId: id, kind: body.kind }, m);
      return id as string;
    });
    return this.get(id);
  }

  async update(actor: Actor, id: string, body: UpdateCellDto): Promise<CellView> {
    if (body.source === undefined && body.kind === undefined && body.title === undefined) {
      throw new BadRequestException({
        message: 'Send source, kind or title to change',
        details: [{ field: 'source', messages: ['source, kind or title is required'] }],
      });
    }
    // Only source and kind make a new cell revision (runs are per revision); a title is a label.
    const content = body.source !== undefined || body.kind !== undefined;
    const updated = await this.db.transaction(async (m) => {
      const [rows] = await m.query(
        `UPDATE cells SET source = coalesce($3, source), kind = coalesce($4, kind), revision = revision + $6::int,
                title = CASE WHEN $7::boolean THEN $8 ELSE title END, author_id = $5, updated_at = now()
          WHERE id = $1 AND revision = $2 RETURNING notebook_id, revision`,
        [id, body.revision, body.source ?? null, body.kind ?? null, actor.id, content ? 1 : 0, body.title !== undefined, cellTitle(body.title)],
      );
      if (!rows.length) return false;
      await this.bumpNotebook(m, rows[0].notebook_id);
      const fields = [
        ...(body.source !== undefined ? ['source'] : []),
        ...(body.kind !== undefined ? ['kind'] : []),
        ...(body.title !== undefined ? ['title'] : []),
      ];
      await this.audit.record(actor.id, 'cell.update', rows[0].notebook_id, { cellId: id, revision: rows[0].revision, fields }, m);
      return true;
    });
    if (!updated) await this.stale(id, body.revision);
    return this.get(id);
  }

  async remove(actor: Actor, id: string, revision?: number): Promise<void> {
    const done = await this.db.transaction(async (m) => {
      const [rows] = await m.query(
        `DELETE FROM cells WHERE id = $1 AND ($2::int IS NULL OR revision = $2) RETURNING notebook_id, position`,
        [id, revision ?? null],
      );
      if (!rows.length) return false;
      const { notebook_id: notebookId, position } = rows[0];
      await m.query(`UPDATE cells SET position = position - 1 WHERE notebook_id = $1 AND position > $2`, [notebookId, position]);
      await this.bumpNotebook(m, notebookId);
      await this.audit.record(actor.id, 'cell.delete', notebookId, { cellId: id }, m);
      return true;
    });
    if (!done) await this.stale(id, revision ?? 0);
  }

  /** Applies a full new order, only at the notebook revision the client saw. */
  async reorder(actor: Actor, notebookId: string, body: ReorderCellsDto): Promise<CellView[]> {
    const outcome = await this.db.transaction(async (m) => {
      const [nb] = await m.query(`SELECT revision FROM notebooks WHERE id = $1 FOR UPDATE`, [notebookId]);
      if (nb.revision !== body.revision) return 'stale' as const;
      const ids: Array<{ id: string }> = await m.query(`SELECT id FROM cells WHERE notebook_id = $1`, [notebookId]);
      const have = new Set(ids.map((r) => r.id));
      const given = new Set(body.cellIds);
      if (given.size !== body.cellIds.length || given.size !== have.size || body.cellIds.some((c) => !have.has(c))) {
        return 'mismatch' as const;
      }
      await m.query(
        `UPDATE cells c SET position = o.pos - 1 FROM unnest($2::uuid[]) WITH ORDINALITY AS o(id, pos)
          WHERE c.id = o.id AND c.notebook_id = $1`,
        [notebookId, body.cellIds],
      );
      await this.bumpNotebook(m, notebookId);
      await this.audit.record(actor.id, 'cell.reorder', notebookId, {}, m);
      return 'ok' as const;
    });
    if (outcome === 'mismatch') {
      throw new BadRequestException({
        message: 'cellIds must list every cell of the notebook exactly once',
        details: [{ field: 'cellIds', messages: ['must list every cell of the notebook exactly once'] }],
      });
    }
    const cells = await this.list(notebookId);
    if (outcome === 'stale') {
      const [{ revision }] = await this.db.query(`SELECT revision FROM notebooks WHERE id = $1`, [notebookId]);
      const details: StaleOrderDetails = { reason: 'stale_revision', revision, cells };
      throw new ConflictException({ message: `The notebook changed since revision ${body.revision}; reload and retry`, details });
    }
    return cells;
  }
}
