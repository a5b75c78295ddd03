import { ConflictException, Inject, Injectable, NotFoundException } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { canonicalJson } from '@cribra/lang';
import {
  NOTEBOOK_TITLE_MAX,
  type DuplicateNotebookResponse,
  type LockExportFormat,
  type LockRecord,
  type VerificationView,
} from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { appConfig } from '../config/app.config';
import type { Actor } from '../members/notebook-policy.service';
import { loadDigestCells, revisionDigest } from '../reviews/revision-digest';
import { ReviewsService } from '../reviews/reviews.service';
import { VerificationsService } from '../reviews/verifications.service';
import { DuplicateNotebookDto } from './dto/duplicate-notebook.dto';
import { freezeNotebook } from './freeze-notebook';
import { lockRecordMarkdown } from './lock-markdown';
import { upgradeLockRecord } from './lock-record-upgrade';

export interface LockFile {
  fileName: string;
  mediaType: string;
  body: string;
}

/** Locking a signed-off notebook, its lock record (read, export, check) and duplication into a draft. */
@Injectable()
export class LocksService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly audit: AuditService,
    private readonly reviews: ReviewsService,
    private readonly verifications: VerificationsService,
  ) {}

  /**
   * Locks the notebook when it is in review with enough valid sign-offs on its current revision
   * digest and nothing running. The notebook row is locked FOR UPDATE meanwhile; a concurrent
   * cell edit that commits after this is refused by the database trigger.
   */
  async lock(actor: Actor, notebookId: string): Promise<LockRecord> {
    await this.reviews.reconcile(notebookId);
    const record = await this.db.transaction(async (m) => {
      const [nb] = await m.query(
        `SELECT n.id, n.title, n.status, n.revision, n.required_signoffs, n.owner_id FROM notebooks n WHERE n.id = $1 FOR UPDATE`,
        [notebookId],
      );
      if (!nb) throw new NotFoundException('Notebook not found');
      const digest = await revisionDigest(m, notebookId);
      const signoffs = await this.reviews.validSignoffs(m, notebookId, digest);
      const blockers = await this.reviews.lockBlockers(m, nb, signoffs.length);
      if (blockers.length) throw new ConflictException({ message: `Cannot lock: ${blockers.join('; ')}`, details: { blockers } });
      const record = await freezeNotebook(m, notebookId, actor.id);
      await this.audit.record(
        actor.id,
        'notebook.lock',
        notebookId,
        { revisionDigest: record.revisionDigest, signers: record.signers.map((s) => s.user.id) },
        m,
      );
      return record;
    });
    return record;
  }

  async record(notebookId: string): Promise<LockRecord> {
    const rows: Array<{ record: Parameters<typeof upgradeLockRecord>[0] }> = await this.db.query(
      `SELECT record FROM notebook_locks WHERE notebook_id = $1`,
      [notebookId],
    );
    if (!rows.length) throw new NotFoundException('This notebook is not locked');
    return upgradeLockRecord(rows[0].record);
  }

  async export(actor: Actor, notebookId: string, format: LockExportFormat): Promise<LockFile> {
    const record = await this.record(notebookId);
    await this.audit.record(actor.id, `export.lock_${format}`, notebookId, {});
    const base = `lock-record-${notebookId.slice(0, 8)}`;
    if (format === 'json') {
      // The canonical form itself (docs/records.md): what recordSha256 is computed over, plus that field.
      return { fileName: `${base}.json`, mediaType: 'application/json; charset=utf-8', body: `${canonicalJson(record)}\n` };
    }
    return { fileName: `${base}.md`, mediaType: 'text/markdown; charset=utf-8', body: lockRecordMarkdown(record, this.cfg.publicUrl) };
  }

  /** Re-runs the locked notebook and compares with the lock record (the record is not changed). */
  async check(actor: Actor, notebookId: string): Promise<VerificationView> {
    const record = await this.record(notebookId);
    const view = await this.verifications.start(actor, notebookId, 'lock', {
      revisionDigest: record.revisionDigest,
      cells: record.cells.map((c) => ({
        id: c.id,
        kind: c.kind,
        position: c.position,
        source: c.source,
        outputDigest: c.outputDigest,
        runId: c.runId,
        engineVersion: c.engineVersion,
        languageVersion: c.languageVersion,
      })),
    });
    await this.audit.record(actor.id, 'lock.check', notebookId, { verificationId: view.id });
    return view;
  }

  /**
   * A new draft owned by `actor` with copies of the cells, of each cell's recorded run (so the
   * outputs stay visible) and of the uploads. Works on any notebook, locked or not: it only reads it.
   */
  async duplicate(actor: Actor, notebookId: string, body: DuplicateNotebookDto): Promise<DuplicateNotebookResponse> {
    const id = await this.db.transaction(async (m) => {
      const [src] = await m.query(`SELECT title, summary, tags, required_signoffs FROM notebooks WHERE id = $1`, [notebookId]);
      if (!src) throw new NotFoundException('Notebook not found');
      const title = (body.title?.trim() || `${src.title} (copy)`).slice(0, NOTEBOOK_TITLE_MAX);
      const [{ id }] = await m.query(
        `INSERT INTO notebooks (title, summary, tags, owner_id, required_signoffs) VALUES ($1, $2, $3, $4, $5) RETURNING id`,
        [title, src.summary, src.tags, actor.id, src.required_signoffs],
      );
      await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, 'owner', $2)`, [id, actor.id]);
      const cells = await loadDigestCells(m, notebookId);
      for (const c of cells) {
        const [{ id: cellId }] = await m.query(
          `INSERT INTO cells (notebook_id, kind, source, position, author_id, title)
           SELECT $1, kind, source, position, author_id, title FROM cells WHERE id = $2 RETURNING id`,
          [id, c.id],
        );
        if (c.runId) {
          await m.query(
            `INSERT INTO runs (notebook_id, cell_id, cell_revision, cell_kind, source, purpose, status, progress, outputs,
                               output_digest, engine_version, language_version, runner_id, attempts, requested_by,
                               queued_at, started_at, finished_at, duration_ms)
             SELECT $1, $2, 1, cell_kind, source, 'run', status, progress, outputs, output_digest, engine_version,
                    language_version, runner_id, attempts, requested_by, queued_at, started_at, finished_at, duration_ms
               FROM runs WHERE id = $3`,
            [id, cellId, c.runId],
          );
        }
      }
      await m.query(
        `INSERT INTO uploads (notebook_id, owner_id, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw)
         SELECT $1, $2, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw
           FROM uploads WHERE notebook_id = $3`,
        [id, actor.id, notebookId],
      );
      await this.audit.record(actor.id, 'notebook.duplicate', notebookId, { copyId: id }, m);
      await this.audit.record(actor.id, 'notebook.create', id, { title, duplicateOf: notebookId }, m);
      return id as string;
    });
    return { id };
  }
}
