import { createHash } from 'node:crypto';
import { ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import {
  RECORDS_PATH,
  type LockRecord,
  type PublicationView,
  type PublishedCell,
  type PublishedRecordView,
  type RecordExportFormat,
  type RunOutput,
  type UserRef,
} from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { appConfig } from '../config/app.config';
import type { Actor } from '../members/notebook-policy.service';
import { citationOf } from './citation';
import type { PublishedContent } from './published-content';
import type { PublishedRecordEntity } from './published-record.entity';
import { recordLatex, recordMarkdown, recordSift } from './record-document';
import { RECORD_ID, recordIdOf, recordSha256 } from './record-hash';

export interface RecordFile {
  fileName: string;
  mediaType: string;
  body: string | Buffer;
}

type Row = Omit<PublishedRecordEntity, 'publishedAt' | 'withdrawnAt'> & { publishedAt: Date; withdrawnAt: Date | null; withdrawnByName: string | null };

const SELECT = `SELECT p.id, p.notebook_id AS "notebookId", p.record_sha256 AS "recordSha256", p.record, p.content,
                       p.published_by AS "publishedBy", p.published_at AS "publishedAt", p.withdrawn_at AS "withdrawnAt",
                       p.withdrawn_by AS "withdrawnBy", p.withdraw_reason AS "withdrawReason", w.display_name AS "withdrawnByName"
                  FROM published_records p LEFT JOIN users w ON w.id = p.withdrawn_by`;

/** The one answer for an id that names no published record, whatever the reason (same body every time). */
const notFound = (): NotFoundException => new NotFoundException('Record not found');

const array = <T>(v: unknown): T[] | null => (Array.isArray(v) ? (v as T[]) : null);

/** Publishing a locked notebook's record at a permanent public address, withdrawing it, reading it signed out. */
@Injectable()
export class RecordsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly audit: AuditService,
  ) {}

  private url(id: string): string {
    return `${this.cfg.publicUrl}${RECORDS_PATH}/${id}`;
  }

  async publish(actor: Actor, notebookId: string): Promise<PublicationView> {
    const id = await this.db.transaction(async (m) => {
      const [nb] = await m.query(`SELECT id, status, summary, owner_id FROM notebooks WHERE id = $1 FOR UPDATE`, [notebookId]);
      if (!nb) throw new NotFoundException('Notebook not found');
      const [existing] = await m.query(`SELECT id FROM published_records WHERE notebook_id = $1`, [notebookId]);
      if (existing) throw new ConflictException({ message: 'This record is already published; a published record never changes', details: { reason: 'already_published', id: existing.id } });
      const [lock] = await m.query(`SELECT record FROM notebook_locks WHERE notebook_id = $1`, [notebookId]);
      if (nb.status !== 'locked' || !lock) throw new ConflictException({ message: 'Only the record of a locked notebook can be published', details: { reason: 'not_locked' } });
      const record = lock.record as LockRecord;
      const sha = recordSha256(record);
      const rid = recordIdOf(sha);
      const content = await this.contentOf(m, notebookId, record, nb.summary as string, actor.id);
      await m.query(
        `INSERT INTO published_records (id, notebook_id, record_sha256, record, content, published_by) VALUES ($1, $2, $3, $4, $5, $6)`,
        [rid, notebookId, sha, JSON.stringify(record), JSON.stringify(content), actor.id],
      );
      await this.audit.record(actor.id, 'record.publish', notebookId, { recordId: rid, recordSha256: sha, url: this.url(rid) }, m);
      return rid;
    });
    return this.viewOf(await this.row(id));
  }

  /** The publication of a notebook (members); 404 when it is not published. */
  async publication(notebookId: string): Promise<PublicationView> {
    const [r] = await this.db.query(`${SELECT} WHERE p.notebook_id = $1`, [notebookId]);
    if (!r) throw new NotFoundException('This notebook\'s record is not published');
    return this.viewOf(r as Row);
  }

  /** Withdraws a published record once, with a reason; it stays readable under a "withdrawn" banner. */
  async withdraw(actor: Actor, notebookId: string, reason: string): Promise<PublicationView> {
    const id = await this.db.transaction(async (m) => {
      const [r] = await m.query(`SELECT id, withdrawn_at FROM published_records WHERE notebook_id = $1 FOR UPDATE`, [notebookId]);
      if (!r) throw new NotFoundException('This notebook\'s record is not published');
      if (r.withdrawn_at) throw new ConflictException({ message: 'This record is already withdrawn', details: { reason: 'already_withdrawn' } });
      await m.query(`UPDATE published_records SET withdrawn_at = now(), withdrawn_by = $2, withdraw_reason = $3 WHERE id = $1`, [r.id, actor.id, reason.trim()]);
      await this.audit.record(actor.id, 'record.withdraw', notebookId, { recordId: r.id, reason: reason.trim() }, m);
      return r.id as string;
    });
    return this.viewOf(await this.row(id));
  }

  /** The public view of a published record (signed out too). */
  async read(id: string): Promise<PublishedRecordView> {
    const r = await this.row(id);
    const base = this.viewOf(r);
    const c = r.content;
    const reviewers = r.record.signers.map((s) => s.user);
    return {
      ...base,
      title: c.title,
      summary: c.summary,
      authors: c.authors,
      reviewers,
      cells: c.cells,
      uploads: c.uploads.map(({ uploadId: _u, ...u }) => u),
      citation: citationOf({ id: r.id, title: c.title, authors: c.authors, reviewers, lockedAt: r.record.lockedAt, url: base.url, recordSha256: r.recordSha256 }),
      verifyCommand: `cribra verify ${this.cfg.publicUrl}/api${RECORDS_PATH}/${r.id}/export?format=json`,
      record: r.record,
    };
  }

  async export(id: string, format: RecordExportFormat): Promise<RecordFile> {
    const v = await this.read(id);
    const base = `record-${id}`;
    switch (format) {
      case 'json':
        // The lock record exactly as frozen: its hash is the one the page states.
        return { fileName: `${base}.json`, mediaType: 'application/json; charset=utf-8', body: `${JSON.stringify(v.record, null, 2)}\n` };
      case 'markdown':
        return { fileName: `${base}.md`, mediaType: 'text/markdown; charset=utf-8', body: recordMarkdown(v) };
      case 'latex':
        return { fileName: `${base}.tex`, mediaType: 'application/x-latex; charset=utf-8', body: recordLatex(v) };
      case 'sift':
        return { fileName: `${base}.sift`, mediaType: 'text/plain; charset=utf-8', body: recordSift(v) };
    }
  }

  /** An upload the record lists, byte for byte as it was read (checked against its SHA-256). */
  async upload(id: string, name: string): Promise<RecordFile> {
    const r = await this.row(id);
    const u = r.content.uploads.find((x) => x.name === name);
    if (!u?.uploadId) throw new NotFoundException(`The record has no upload "${name}"`);
    const [row] = await this.db.query(`SELECT raw, original_name FROM uploads WHERE id = $1 AND notebook_id = $2`, [u.uploadId, r.notebookId]);
    const raw: Buffer | undefined = row?.raw;
    if (!raw || createHash('sha256').update(raw).digest('hex') !== u.sha256) throw new NotFoundException(`The content of upload "${name}" is no longer available`);
    const ext = /\.[A-Za-z0-9]{1,8}$/.exec(row.original_name ?? '')?.[0] ?? '';
    return { fileName: `${name}${ext}`, mediaType: u.mediaType, body: raw };
  }

  private async row(id: string): Promise<Row> {
    if (!RECORD_ID.test(id)) throw notFound();
    const [r] = await this.db.query(`${SELECT} WHERE p.id = $1`, [id]);
    if (!r) throw notFound();
    return r as Row;
  }

  private viewOf(r: Row): PublicationView {
    return {
      id: r.id,
      notebookId: r.notebookId,
      url: this.url(r.id),
      recordSha256: r.recordSha256,
      publishedAt: new Date(r.publishedAt).toISOString(),
      publishedBy: r.content.publishedBy,
      withdrawal: r.withdrawnAt ? { at: new Date(r.withdrawnAt).toISOString(), by: { id: r.withdrawnBy!, displayName: r.withdrawnByName ?? '' }, reason: r.withdrawReason ?? '' } : null,
    };
  }

  /**
   * What the page shows beside the record, read once at publication: fields the record holds are
   * used as they are (authors, summary, cell titles and outputs, uploads), anything missing is taken
   * from the locked notebook (its runs and uploads cannot change any more).
   */
  private async contentOf(m: EntityManager, notebookId: string, record: LockRecord, summary: string, publisherId: string): Promise<PublishedContent> {
    const rec = record as LockRecord & { summary?: unknown; authors?: unknown; uploads?: unknown };
    const people: Array<{ id: string; display_name: string; role: string }> = await m.query(
      `SELECT u.id, u.display_name, m.role FROM notebook_members m JOIN users u ON u.id = m.user_id
        WHERE m.notebook_id = $1 AND m.role IN ('owner', 'editor') ORDER BY (m.role = 'owner') DESC, m.added_at, u.display_name`,
      [notebookId],
    );
    const authors: UserRef[] =
      array<UserRef>(rec.authors)?.filter((a) => a && typeof a.displayName === 'string').map((a) => ({ id: a.id, displayName: a.displayName })) ??
      people.map((p) => ({ id: p.id, displayName: p.display_name }));
    const [me] = await m.query(`SELECT id, display_name FROM users WHERE id = $1`, [publisherId]);
    const cells: PublishedCell[] = [];
    for (const c of record.cells) {
      const own = c as typeof c & { title?: unknown; outputs?: unknown };
      let outputs = array<RunOutput>(own.outputs);
      if (!outputs && c.runId) {
        const [run] = await m.query(`SELECT outputs FROM runs WHERE id = $1`, [c.runId]);
        outputs = array<RunOutput>(run?.outputs);
      }
      cells.push({
        id: c.id,
        position: c.position,
        kind: c.kind,
        title: typeof own.title === 'string' ? own.title : null,
        source: c.source,
        outputDigest: c.outputDigest,
        outputs: c.kind === 'note' ? null : outputs,
      });
    }
    const listed = array<{ name?: string; sha256?: string }>(rec.uploads);
    const rows: Array<{ id: string; name: string; kind: string; media_type: string; size_bytes: number; sha256: string }> = await m.query(
      `SELECT id, name, kind, media_type, size_bytes, sha256 FROM uploads WHERE notebook_id = $1 ORDER BY name`,
      [notebookId],
    );
    const uploads = rows
      .filter((u) => !listed || listed.some((l) => l.name === u.name))
      .map((u) => ({ uploadId: u.id, name: u.name, kind: u.kind, mediaType: u.media_type, sizeBytes: u.size_bytes, sha256: u.sha256.trim() }));
    return {
      title: record.title,
      summary: typeof rec.summary === 'string' ? rec.summary : summary,
      authors,
      publishedBy: { id: me.id, displayName: me.display_name },
      cells,
      uploads,
    };
  }
}
