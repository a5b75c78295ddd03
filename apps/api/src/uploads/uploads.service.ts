import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash } from 'node:crypto';
import { DataSource } from 'typeorm';
import { UPLOAD_MAX_BYTES, UPLOAD_NAME_PATTERN, type UploadContent, type UploadParseDetails, type UploadView } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { UploadParsePool } from './upload-parse-pool';
import { kindOf } from './upload-parser';

/** What the multer file interceptor hands over (memory storage: nothing touches the disk). */
export interface IncomingFile {
  originalname: string;
  mimetype: string;
  size: number;
  buffer: Buffer;
}

/** Media types browsers and tools send for plain text and CSV. */
export const TEXT_TYPES = new Set(['text/plain', 'text/csv', 'application/csv', 'application/vnd.ms-excel', 'application/octet-stream', 'text/x-csv']);

interface UploadRow {
  id: string;
  notebook_id: string;
  name: string;
  original_name: string;
  kind: UploadView['kind'];
  media_type: string;
  size_bytes: number;
  sha256: string;
  row_count: number;
  columns: string[] | null;
  owner_id: string;
  owner_name: string;
  created_at: Date;
}

const SELECT = `
  SELECT up.id, up.notebook_id, up.name, up.original_name, up.kind, up.media_type, up.size_bytes, up.sha256,
         up.row_count, up.columns, up.owner_id, u.display_name AS owner_name, up.created_at
    FROM uploads up JOIN users u ON u.id = up.owner_id`;

const toView = (r: UploadRow): UploadView => ({
  id: r.id,
  notebookId: r.notebook_id,
  name: r.name,
  originalName: r.original_name,
  kind: r.kind,
  mediaType: r.media_type,
  sizeBytes: r.size_bytes,
  sha256: r.sha256,
  rowCount: r.row_count,
  columns: r.columns,
  owner: { id: r.owner_id, displayName: r.owner_name },
  createdAt: new Date(r.created_at).toISOString(),
});

function refuse(message: string, details: UploadParseDetails): BadRequestException {
  return new BadRequestException({ message, details });
}

/** Default upload name: the file name without extension, made to fit the name pattern. */
function defaultName(fileName: string): string {
  const stem = fileName.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9_.-]/g, '_').slice(0, 60);
  return /^[A-Za-z]/.test(stem) ? stem : `u_${stem}`.slice(0, 64);
}

@Injectable()
export class UploadsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly audit: AuditService,
    private readonly parser: UploadParsePool,
  ) {}

  async list(notebookId: string): Promise<UploadView[]> {
    const rows: UploadRow[] = await this.db.query(`${SELECT} WHERE up.notebook_id = $1 ORDER BY up.name`, [notebookId]);
    return rows.map(toView);
  }

  async notebookOf(id: string): Promise<string> {
    const rows: Array<{ notebook_id: string }> = await this.db.query(`SELECT notebook_id FROM uploads WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Upload not found');
    return rows[0].notebook_id;
  }

  async get(id: string): Promise<UploadView> {
    const rows: UploadRow[] = await this.db.query(`${SELECT} WHERE up.id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Upload not found');
    return toView(rows[0]);
  }

  async content(id: string): Promise<UploadContent> {
    const rows: Array<{ content: UploadContent }> = await this.db.query(`SELECT content FROM uploads WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Upload not found');
    return rows[0].content;
  }

  /** Checks, parses and stores a file in one statement: on any problem nothing is stored. */
  async create(actor: Actor, notebookId: string, file: IncomingFile | undefined, name?: string): Promise<UploadView> {
    if (!file) throw refuse('Attach the file in the multipart field "file"', { reason: 'empty', errors: [] });
    if (file.size > UPLOAD_MAX_BYTES) {
      throw refuse(`The file is larger than ${UPLOAD_MAX_BYTES} bytes`, { reason: 'too_large', errors: [] });
    }
    const kind = kindOf(file.originalname);
    if (!kind || !TEXT_TYPES.has(file.mimetype.split(';')[0].trim().toLowerCase())) {
      throw refuse('Only tuple files (.txt, .tuples: one integer per line) and CSV tables (.csv) can be uploaded', {
        reason: 'bad_type',
        errors: [],
      });
    }
    if (file.size === 0) throw refuse('The file is empty', { reason: 'empty', errors: [] });
    const uploadName = name ?? defaultName(file.originalname);
    if (!new RegExp(UPLOAD_NAME_PATTERN).test(uploadName)) {
      throw refuse(`"${uploadName}" cannot be used as an upload name`, { reason: 'bad_name', errors: [] });
    }
    // Decoding and parsing happen in a worker thread: the request thread stays free for others.
    const parsed = await this.parser.parse(kind, file.buffer);
    if (parsed === null) {
      throw refuse('The file is not UTF-8 text', { reason: 'bad_type', errors: [{ line: 1, message: 'not UTF-8 text' }] });
    }
    if (!parsed.ok) {
      const first = parsed.errors[0];
      throw refuse(`Line ${first.line}: ${first.message}`, { reason: 'parse_error', errors: parsed.errors });
    }
    const sha256 = createHash('sha256').update(file.buffer).digest('hex');
    const rows: Array<{ id: string }> = await this.db.query(
      `INSERT INTO uploads (notebook_id, owner_id, name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content, raw)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12)
       ON CONFLICT (notebook_id, name) DO NOTHING RETURNING id`,
      [
        notebookId,
        actor.id,
        uploadName,
        file.originalname.slice(0, 255),
        kind,
        file.mimetype.slice(0, 100),
        file.size,
        sha256,
        parsed.rowCount,
        parsed.columns ? JSON.stringify(parsed.columns) : null,
        JSON.stringify(parsed.content),
        file.buffer,
      ],
    );
    if (!rows.length) {
      throw refuse(`This notebook already has an upload named "${uploadName}"`, { reason: 'duplicate_name', errors: [] });
    }
    await this.audit.record(actor.id, 'upload.create', notebookId, { uploadId: rows[0].id, name: uploadName, kind, sha256 });
    return this.get(rows[0].id);
  }

  async remove(actor: Actor, id: string): Promise<void> {
    const [rows] = await this.db.query(`DELETE FROM uploads WHERE id = $1 RETURNING notebook_id, name`, [id]);
    if (!rows.length) throw new NotFoundException('Upload not found');
    await this.audit.record(actor.id, 'upload.delete', rows[0].notebook_id, { uploadId: id, name: rows[0].name });
  }
}
