import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type {
  MemberRole,
  NotebookSummary,
  NotebookView,
  Page,
  StaleNotebookDetails,
} from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { type CellViewOptions, loadNotebookCells } from '../cells/cell-views';
import { MembersService } from '../members/members.service';
import type { Actor } from '../members/notebook-policy.service';
import { CreateNotebookDto } from './dto/create-notebook.dto';
import { ListNotebooksDto } from './dto/list-notebooks.dto';
import { UpdateNotebookDto } from './dto/update-notebook.dto';
import { readNotebookUpload } from './notebook-import';
import type { IncomingFile } from '../uploads/uploads.service';

interface SummaryRow {
  id: string;
  title: string;
  summary: string;
  tags: string[];
  status: NotebookSummary['status'];
  revision: number;
  required_signoffs: number;
  owner_id: string;
  owner_name: string;
  my_role: MemberRole | null;
  cell_count: number;
  created_at: Date;
  updated_at: Date;
}

const toSummary = (r: SummaryRow): NotebookSummary => ({
  id: r.id,
  title: r.title,
  summary: r.summary,
  tags: r.tags,
  status: r.status,
  revision: r.revision,
  requiredSignoffs: r.required_signoffs,
  owner: { id: r.owner_id, displayName: r.owner_name },
  myRole: r.my_role,
  cellCount: r.cell_count,
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

/** $1 is always the viewing user's id. */
const SELECT_SUMMARY = `
  SELECT n.id, n.title, n.summary, n.tags, n.status, n.revision, n.required_signoffs, n.owner_id,
         o.display_name AS owner_name, me.role AS my_role,
         (SELECT count(*)::int FROM cells c WHERE c.notebook_id = n.id) AS cell_count,
         n.created_at, n.updated_at
    FROM notebooks n
    JOIN users o ON o.id = n.owner_id
    LEFT JOIN notebook_members me ON me.notebook_id = n.id AND me.user_id = $1`;

@Injectable()
export class NotebooksService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly members: MembersService,
    private readonly audit: AuditService,
  ) {}

  /** Notebooks the user is a member of (admins: all), filtered, searched, newest change first. */
  async list(actor: Actor, q: ListNotebooksDto): Promise<Page<NotebookSummary>> {
    const page = q.page ?? 1;
    const pageSize = q.pageSize ?? 20;
    const where: string[] = [];
    const params: unknown[] = [actor.id];
    const add = (sql: string, value: unknown): void => {
      params.push(value);
      where.push(sql.replace('?', `$${params.length}`));
    };
    if (actor.siteRole !== 'admin' || q.role) where.push('me.role IS NOT NULL');
    if (q.role) add('me.role = ?', q.role);
    if (q.status) add('n.status = ?', q.status);
    if (q.tag) add('? = ANY(n.tags)', q.tag.trim().toLowerCase());
    let rank = 'NULL::real';
    if (q.q && q.q.trim()) {
      params.push(q.q.trim());
      const i = params.length;
      // Full-text match, or a title prefix so that half-typed words still find something.
      where.push(`(n.search @@ websearch_to_tsquery('simple', $${i}) OR lower(n.title) LIKE lower($${i + 1}) || '%')`);
      params.push(q.q.trim().replace(/[\\%_]/g, (m) => `\\${m}`));
      rank = `ts_rank(n.search, websearch_to_tsquery('simple', $${i}))`;
    }
    const filter = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const [{ n }] = await this.db.query(
      `SELECT count(*)::int AS n FROM notebooks n LEFT JOIN notebook_members me ON me.notebook_id = n.id AND me.user_id = $1 ${filter}`,
      params,
    );
    const rows: SummaryRow[] = await this.db.query(
      `${SELECT_SUMMARY} ${filter} ORDER BY ${rank} DESC NULLS LAST, n.updated_at DESC, n.id
        LIMIT ${pageSize} OFFSET ${(page - 1) * pageSize}`,
      params,
    );
    return { items: rows.map(toSummary), total: n, page, pageSize };
  }

  async summary(actor: Actor, id: string): Promise<NotebookSummary> {
    const rows: SummaryRow[] = await this.db.query(`${SELECT_SUMMARY} WHERE n.id = $2`, [actor.id, id]);
    if (!rows.length) throw new NotFoundException('Notebook not found');
    return toSummary(rows[0]);
  }

  /** `opts.inlineOutputsUpTo`: the read's summary form (heavy outputs left out, fetched per run). */
  async view(actor: Actor, id: string, opts: CellViewOptions = {}): Promise<NotebookView> {
    const [summary, cells, members] = await Promise.all([this.summary(actor, id), loadNotebookCells(this.db, id, opts), this.members.list(id)]);
    return { ...summary, cells, members };
  }

  async create(actor: Actor, body: CreateNotebookDto): Promise<NotebookView> {
    const id = await this.db.transaction(async (m) => {
      const [{ id }] = await m.query(
        `INSERT INTO notebooks (title, summary, tags, owner_id, required_signoffs)
         VALUES ($1, $2, $3, $4, $5) RETURNING id`,
        [body.title, body.summary ?? '', body.tags ?? [], actor.id, body.requiredSignoffs ?? 1],
      );
      await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, 'owner', $2)`, [
        id,
        actor.id,
      ]);
      await this.audit.record(actor.id, 'notebook.create', id, { title: body.title }, m);
      return id as string;
    });
    return this.view(actor, id);
  }

  /**
   * A new notebook owned by `actor` from a `.sift` notebook file: title, summary and tags from its
   * header, its cells with kinds and titles (no runs: outputs are computed by running it). Every
   * problem of the file is refused with its line before anything is written; the rows are then
   * written in one transaction.
   */
  async importFile(actor: Actor, file: IncomingFile | undefined): Promise<NotebookView> {
    const read = readNotebookUpload(file);
    if (!read.ok) throw new BadRequestException({ message: read.message, details: read.details });
    const nb = read.notebook;
    const id = await this.db.transaction(async (m) => {
      const [{ id }] = await m.query(
        `INSERT INTO notebooks (title, summary, tags, owner_id, required_signoffs, revision) VALUES ($1, $2, $3, $4, 1, $5) RETURNING id`,
        [nb.title, nb.summary, nb.tags, actor.id, 1 + nb.cells.length],
      );
      await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, 'owner', $2)`, [id, actor.id]);
      if (nb.cells.length) {
        await m.query(
          `INSERT INTO cells (notebook_id, kind, title, source, position, author_id)
           SELECT $1, c.kind, c.title, c.source, c.pos - 1, $2
             FROM unnest($3::varchar[], $4::varchar[], $5::text[]) WITH ORDINALITY AS c(kind, title, source, pos)`,
          [id, actor.id, nb.cells.map((c) => c.kind), nb.cells.map((c) => c.title), nb.cells.map((c) => c.source)],
        );
      }
      await this.audit.record(actor.id, 'notebook.create', id, { title: nb.title, importedFrom: file?.originalname.slice(0, 255), cells: nb.cells.length }, m);
      return id as string;
    });
    return this.view(actor, id);
  }

  /** Optimistic update: applies only when `revision` is the current one, else 409 with the current state. */
  async update(actor: Actor, id: string, body: UpdateNotebookDto): Promise<NotebookView> {
    const sets: string[] = [];
    const params: unknown[] = [id, body.revision];
    const set = (col: string, v: unknown): void => {
      params.push(v);
      sets.push(`${col} = $${params.length}`);
    };
    if (body.title !== undefined) set('title', body.title);
    if (body.summary !== undefined) set('summary', body.summary);
    if (body.tags !== undefined) set('tags', body.tags);
    if (body.requiredSignoffs !== undefined) set('required_signoffs', body.requiredSignoffs);
    const result: [unknown[], number] = await this.db.query(
      `UPDATE notebooks SET ${[...sets, 'revision = revision + 1', 'updated_at = now()'].join(', ')}
        WHERE id = $1 AND revision = $2 AND status <> 'locked' RETURNING id`,
      params,
    );
    if (result[1] === 0) {
      const current = await this.summary(actor, id);
      const details: StaleNotebookDetails = { reason: 'stale_revision', current };
      throw new ConflictException({
        message: `The notebook changed since revision ${body.revision} (now ${current.revision}); reload and retry`,
        details,
      });
    }
    await this.audit.record(actor.id, 'notebook.update', id, { fields: Object.keys(body).filter((k) => k !== 'revision') });
    return this.view(actor, id);
  }

  async remove(actor: Actor, id: string): Promise<void> {
    await this.db.transaction(async (m) => {
      await m.query(`DELETE FROM notebooks WHERE id = $1`, [id]);
      await this.audit.record(actor.id, 'notebook.delete', id, {}, m);
    });
  }
}
