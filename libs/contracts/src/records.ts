import type { RunOutput, UserRef } from './notebooks';
import type { LockRecord } from './lock-record';

/**
 * Published records: the lock record of a locked notebook at a permanent public address.
 *
 *   POST /api/notebooks/:id/publication                       → 201 PublicationView (owner; the notebook is locked)
 *   GET  /api/notebooks/:id/publication                       → PublicationView (members; 404 when not published)
 *   POST /api/notebooks/:id/publication/withdrawal  WithdrawRecordBody → PublicationView (owner; once)
 *   GET  /api/records/:id                                     → PublishedRecordView (anyone, signed out too)
 *   GET  /api/records/:id/export?format=json|markdown|latex|sift → attachment (anyone)
 *   GET  /api/records/:id/uploads/:name                       → the upload as it was read (anyone)
 *
 * A record that is not published answers 404 with exactly the body of an id that names nothing.
 */
export const RECORDS_PATH = '/records';

/** Characters of the record's SHA-256 (hex) that make its public id. */
export const RECORD_ID_LENGTH = 20;
export const WITHDRAW_REASON_MAX = 2000;

export type RecordExportFormat = 'json' | 'markdown' | 'latex' | 'sift';

export interface RecordWithdrawal {
  at: string;
  by: UserRef;
  reason: string;
}

export interface PublicationView {
  id: string;
  notebookId: string;
  /** `${PUBLIC_URL}/records/<id>`. */
  url: string;
  recordSha256: string;
  publishedAt: string;
  publishedBy: UserRef;
  withdrawal: RecordWithdrawal | null;
}

/** One cell of a published record, with the outputs its recorded run produced. */
export interface PublishedCell {
  id: string;
  position: number;
  kind: string;
  title: string | null;
  source: string;
  outputDigest: string | null;
  outputs: RunOutput[] | null;
}

export interface PublishedUpload {
  name: string;
  kind: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
}

export interface RecordCitation {
  bibtex: string;
  text: string;
}

export interface PublishedRecordView extends PublicationView {
  title: string;
  summary: string;
  /** Owner first, then the editors, when the record was published. */
  authors: UserRef[];
  /** The signers of the lock record. */
  reviewers: UserRef[];
  cells: PublishedCell[];
  uploads: PublishedUpload[];
  citation: RecordCitation;
  /** The command that checks the record offline with the local engine. */
  verifyCommand: string;
  /** The lock record exactly as frozen (every field it holds; its hash is recordSha256). */
  record: LockRecord;
}

export interface WithdrawRecordBody {
  reason: string;
}
