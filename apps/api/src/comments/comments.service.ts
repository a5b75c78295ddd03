import { BadRequestException, Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import type { CommentAnchor, CommentThreadView, CommentView, ThreadStatus, UserRef } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { appConfig } from '../config/app.config';
import { composeMail } from '../mail/compose-mail';
import { MailService } from '../mail/mail.service';
import type { Actor } from '../members/notebook-policy.service';
import { CommentBodyDto } from './dto/comment-body.dto';
import { CreateThreadDto, ListThreadsDto } from './dto/create-thread.dto';

interface ThreadRow {
  id: string;
  notebook_id: string;
  anchor_kind: CommentAnchor['kind'];
  cell_id: string | null;
  run_id: string | null;
  output_index: number | null;
  status: ThreadStatus;
  created_by: string;
  creator_name: string;
  created_at: Date;
  resolved_by: string | null;
  resolver_name: string | null;
  resolved_at: Date | null;
}

interface CommentRow {
  id: string;
  thread_id: string;
  author_id: string;
  author_name: string;
  body: string;
  mentions: string[];
  created_at: Date;
  edited_at: Date | null;
}

const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

function anchorOf(r: ThreadRow): CommentAnchor {
  if (r.anchor_kind === 'notebook') return { kind: 'notebook' };
  if (r.anchor_kind === 'cell') return { kind: 'cell', cellId: r.cell_id! };
  return { kind: 'output', cellId: r.cell_id!, runId: r.run_id ?? '', outputIndex: r.output_index! };
}

const SELECT_THREADS = `
  SELECT t.*, c.display_name AS creator_name, r.display_name AS resolver_name
    FROM comment_threads t JOIN users c ON c.id = t.created_by LEFT JOIN users r ON r.id = t.resolved_by`;

/** Comment threads on notebooks, cells and outputs; @mentions are told by e-mail. */
@Injectable()
export class CommentsService {
  private readonly logger = new Logger('Comments');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly mail: MailService,
    private readonly audit: AuditService,
  ) {}

  async notebookOfThread(id: string): Promise<string> {
    const rows: Array<{ notebook_id: string }> = await this.db.query(`SELECT notebook_id FROM comment_threads WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Thread not found');
    return rows[0].notebook_id;
  }

  async commentInfo(id: string): Promise<{ notebookId: string; authorId: string; threadId: string }> {
    const rows: Array<{ notebook_id: string; author_id: string; thread_id: string }> = await this.db.query(
      `SELECT t.notebook_id, c.author_id, c.thread_id FROM comments c JOIN comment_threads t ON t.id = c.thread_id WHERE c.id = $1`,
      [id],
    );
    if (!rows.length) throw new NotFoundException('Comment not found');
    return { notebookId: rows[0].notebook_id, authorId: rows[0].author_id, threadId: rows[0].thread_id };
  }

  private async views(db: DataSource | EntityManager, threads: ThreadRow[]): Promise<CommentThreadView[]> {
    if (!threads.length) return [];
    const comments: CommentRow[] = await db.query(
      `SELECT c.*, u.display_name AS author_name FROM comments c JOIN users u ON u.id = c.author_id
        WHERE c.thread_id = ANY($1::uuid[]) ORDER BY c.created_at, c.id`,
      [threads.map((t) => t.id)],
    );
    const mentionIds = [...new Set(comments.flatMap((c) => c.mentions))];
    const names = new Map<string, string>();
    if (mentionIds.length) {
      const users: Array<{ id: string; display_name: string }> = await db.query(
        `SELECT id, display_name FROM users WHERE id = ANY($1::uuid[])`,
        [mentionIds],
      );
      for (const u of users) names.set(u.id, u.display_name);
    }
    const byThread = new Map<string, CommentView[]>();
    for (const c of comments) {
      const view: CommentView = {
        id: c.id,
        threadId: c.thread_id,
        author: { id: c.author_id, displayName: c.author_name },
        body: c.body,
        mentions: c.mentions.map((id): UserRef => ({ id, displayName: names.get(id) ?? '' })),
        createdAt: iso(c.created_at)!,
        editedAt: iso(c.edited_at),
      };
      byThread.set(c.thread_id, [...(byThread.get(c.thread_id) ?? []), view]);
    }
    return threads.map((t) => ({
      id: t.id,
      notebookId: t.notebook_id,
      anchor: anchorOf(t),
      status: t.status,
      createdBy: { id: t.created_by, displayName: t.creator_name },
      createdAt: iso(t.created_at)!,
      resolvedBy: t.resolved_by ? { id: t.resolved_by, displayName: t.resolver_name ?? '' } : null,
      resolvedAt: iso(t.resolved_at),
      comments: byThread.get(t.id) ?? [],
    }));
  }

  async list(notebookId: string, q: ListThreadsDto): Promise<CommentThreadView[]> {
    const params: unknown[] = [notebookId];
    let where = 't.notebook_id = $1';
    if (q.status) {
      params.push(q.status);
      where += ` AND t.status = $${params.length}`;
    }
    if (q.cellId) {
      params.push(q.cellId);
      where += ` AND t.cell_id = $${params.length}`;
    }
    const threads: ThreadRow[] = await this.db.query(`${SELECT_THREADS} WHERE ${where} ORDER BY t.created_at, t.id`, params);
    return this.views(this.db, threads);
  }

  async thread(id: string): Promise<CommentThreadView> {
    const threads: ThreadRow[] = await this.db.query(`${SELECT_THREADS} WHERE t.id = $1`, [id]);
    if (!threads.length) throw new NotFoundException('Thread not found');
    return (await this.views(this.db, threads))[0];
  }

  /** The anchor must point into this notebook (cell of the notebook; output of a run of that cell). */
  private async checkAnchor(notebookId: string, anchor: CreateThreadDto['anchor']): Promise<void> {
    if (anchor.kind === 'notebook') return;
    const cells: unknown[] = await this.db.query(`SELECT 1 FROM cells WHERE id = $1 AND notebook_id = $2`, [anchor.cellId, notebookId]);
    if (!cells.length) {
      throw new BadRequestException({
        message: 'anchor.cellId is not a cell of this notebook',
        details: [{ field: 'anchor.cellId', messages: ['not a cell of this notebook'] }],
      });
    }
    if (anchor.kind === 'output') {
      const runs: Array<{ n: number | null }> = await this.db.query(
        `SELECT jsonb_array_length(outputs) AS n FROM runs WHERE id = $1 AND cell_id = $2`,
        [anchor.runId, anchor.cellId],
      );
      if (!runs.length || runs[0].n === null || anchor.outputIndex >= runs[0].n) {
        throw new BadRequestException({
          message: 'anchor.runId/outputIndex do not name an output of this cell',
          details: [{ field: 'anchor.outputIndex', messages: ['no such output of this cell'] }],
        });
      }
    }
  }

  /** Mentioned ids must be members of the notebook. */
  private async checkMentions(notebookId: string, ids: string[] | undefined): Promise<string[]> {
    const unique = [...new Set(ids ?? [])];
    if (!unique.length) return [];
    const rows: Array<{ user_id: string }> = await this.db.query(
      `SELECT user_id FROM notebook_members WHERE notebook_id = $1 AND user_id = ANY($2::uuid[])`,
      [notebookId, unique],
    );
    const members = new Set(rows.map((r) => r.user_id));
    const outsiders = unique.filter((id) => !members.has(id));
    if (outsiders.length) {
      throw new BadRequestException({
        message: 'Only members of the notebook can be mentioned',
        details: [{ field: 'mentions', messages: [`not members: ${outsiders.join(', ')}`] }],
      });
    }
    return unique;
  }

  private async tellMentioned(actor: Actor, notebookId: string, userIds: string[], body: string): Promise<void> {
    const others = userIds.filter((id) => id !== actor.id);
    if (!others.length) return;
    const rows: Array<{ email: string; display_name: string; title: string; actor_name: string }> = await this.db.query(
      `SELECT u.email, u.display_name, n.title, a.display_name AS actor_name
         FROM users u, notebooks n, users a WHERE u.id = ANY($1::uuid[]) AND n.id = $2 AND a.id = $3`,
      [others, notebookId, actor.id],
    );
    const excerpt = body.length > 600 ? `${body.slice(0, 600)}…` : body;
    for (const r of rows) {
      try {
        const content = composeMail({
          greeting: `Hello ${r.display_name},`,
          intro: [`${r.actor_name} mentioned you in a comment on the notebook "${r.title}":`],
          quote: excerpt,
          link: { href: `${this.cfg.publicUrl}/notebooks/${notebookId}`, label: 'Open the notebook' },
          outro: [],
        });
        await this.mail.send({ to: r.email, subject: `${r.actor_name} mentioned you in "${r.title}"`, ...content });
      } catch (err) {
        // A comment is saved even when the SMTP server is down; the mention stays visible in the thread.
        this.logger.warn(`Could not mail a mention to ${r.email}: ${(err as Error).message}`);
      }
    }
  }

  async createThread(actor: Actor, notebookId: string, body: CreateThreadDto): Promise<CommentThreadView> {
    await this.checkAnchor(notebookId, body.anchor);
    const mentions = await this.checkMentions(notebookId, body.mentions);
    const a = body.anchor;
    const id = await this.db.transaction(async (m) => {
      const [{ id }] = await m.query(
        `INSERT INTO comment_threads (notebook_id, anchor_kind, cell_id, run_id, output_index, created_by)
         VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
        [
          notebookId,
          a.kind,
          a.kind === 'notebook' ? null : a.cellId,
          a.kind === 'output' ? a.runId : null,
          a.kind === 'output' ? a.outputIndex : null,
          actor.id,
        ],
      );
      await m.query(`INSERT INTO comments (thread_id, author_id, body, mentions) VALUES ($1, $2, $3, $4)`, [
        id,
        actor.id,
        body.body,
        mentions,
      ]);
      return id as string;
    });
    await this.tellMentioned(actor, notebookId, mentions, body.body);
    return this.thread(id);
  }

  async reply(actor: Actor, threadId: string, body: CommentBodyDto): Promise<CommentView> {
    const notebookId = await this.notebookOfThread(threadId);
    const mentions = await this.checkMentions(notebookId, body.mentions);
    const [{ id }] = await this.db.query(
      `INSERT INTO comments (thread_id, author_id, body, mentions) VALUES ($1, $2, $3, $4) RETURNING id`,
      [threadId, actor.id, body.body, mentions],
    );
    await this.tellMentioned(actor, notebookId, mentions, body.body);
    return this.comment(threadId, id);
  }

  private async comment(threadId: string, id: string): Promise<CommentView> {
    const found = (await this.thread(threadId)).comments.find((c) => c.id === id);
    if (!found) throw new NotFoundException('Comment not found');
    return found;
  }

  /** Edits one's own comment (authorship checked by the policy before); new mentions are told. */
  async edit(actor: Actor, id: string, body: CommentBodyDto): Promise<CommentView> {
    const info = await this.commentInfo(id);
    const before: Array<{ mentions: string[] }> = await this.db.query(`SELECT mentions FROM comments WHERE id = $1`, [id]);
    const mentions = body.mentions === undefined ? before[0].mentions : await this.checkMentions(info.notebookId, body.mentions);
    await this.db.query(`UPDATE comments SET body = $2, mentions = $3, edited_at = now() WHERE id = $1`, [id, body.body, mentions]);
    const fresh = mentions.filter((m) => !before[0].mentions.includes(m));
    await this.tellMentioned(actor, info.notebookId, fresh, body.body);
    return this.comment(info.threadId, id);
  }

  async setStatus(actor: Actor, threadId: string, status: ThreadStatus): Promise<CommentThreadView> {
    const notebookId = await this.notebookOfThread(threadId);
    await this.db.query(
      status === 'resolved'
        ? `UPDATE comment_threads SET status = 'resolved', resolved_by = $2, resolved_at = now() WHERE id = $1`
        : `UPDATE comment_threads SET status = 'open', resolved_by = NULL, resolved_at = NULL WHERE id = $1 AND $2::uuid IS NOT NULL`,
      [threadId, actor.id],
    );
    await this.audit.record(actor.id, status === 'resolved' ? 'thread.resolve' : 'thread.reopen', notebookId, { threadId });
    return this.thread(threadId);
  }
}
