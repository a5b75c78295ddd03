// The lock record: what a locked notebook froze, self-contained (readable and re-checkable without
// the app). Schema: docs/records.md and docs/lock-record.schema.json. Types and constants only.
import type { CellKind, RunOutput, UploadContent, UploadView, UserRef } from './notebooks';
import type { VerificationCellStatus } from './review';

/** Version tag of records written by this code. Records locked before it read as 'cribra-record-v0'. */
export const LOCK_RECORD_VERSION = 'cribra-record-v1';
export type LockRecordVersion = 'cribra-record-v0' | 'cribra-record-v1';

/**
 * A cell's outputs are embedded in full when their canonical JSON is at most this many bytes
 * (UTF-8); above it `outputs` is null and `outputsComplete` false (the digest still binds them).
 */
export const RECORD_OUTPUTS_MAX_BYTES = 1_048_576;
/** An upload's parsed content is embedded when the uploaded file is at most this many bytes. */
export const RECORD_UPLOAD_EMBED_MAX_BYTES = 262_144;

/** Owner and editors of the notebook when it was locked. */
export interface RecordAuthor extends UserRef {
  role: 'owner' | 'editor';
}

/** The re-verification a sign-off rests on (every executable cell re-run from source). */
export interface RecordVerification {
  id: string;
  /** Revision digest of the notebook when the re-verify ran. */
  revisionDigest: string;
  startedAt: string;
  finishedAt: string | null;
  /** Executable cells re-run, and how many of them gave the recorded digest. */
  cellsRerun: number;
  cellsSame: number;
}

export interface LockSigner {
  reviewId: string;
  user: UserRef;
  signedAt: string;
  verificationId: string | null;
  comment: string;
  /** The revision digest the sign-off binds to (v1; equal to the record's). */
  revisionDigest?: string;
  /** v1: the re-verification the sign-off rests on (null when none is recorded). */
  verification?: RecordVerification | null;
}

/** One bound name of a claim and the domain it ranges over, as written (`p` over `primes 5..29`). */
export interface RecordBinder {
  name: string;
  domain: string;
}

/** One claim of a claim cell: its verdict and exactly what was checked. */
export interface RecordClaim {
  label: string | null;
  /** The claim as written. */
  statement: string;
  verdict: 'holds' | 'fails';
  /** The quantifier as written, or null for a claim without `over`. */
  over: string | null;
  binders: RecordBinder[];
  /** Conditions of the `over` part that leave cases out, as written. */
  conditions: string[];
  /** Cases evaluated (the failing one included) and cases the conditions left out. */
  checked: number;
  skipped: number;
  /** First and last case checked: [name, value] pairs, values as Sift value JSON. */
  first: Array<[string, unknown]> | null;
  last: Array<[string, unknown]> | null;
  /** The first counterexample with both sides of the failed relation; null when the claim holds. */
  counterexample: { binding: Array<[string, unknown]>; relation: string | null; lhs: unknown; rhs: unknown } | null;
  summary: string;
}

export interface LockedCell {
  id: string;
  position: number;
  kind: CellKind | string;
  /** v1: the cell's title (null when it has none, and on v0 records). */
  title: string | null;
  /** sha-256 (hex) of the UTF-8 source. */
  sourceSha256: string;
  source: string;
  /** The cell revision the recorded run ran (null for notes, unrun cells and v0 records). */
  cellRevision: number | null;
  outputDigest: string | null;
  runId: string | null;
  engineVersion: string | null;
  languageVersion: string | null;
  /**
   * The recorded run's outputs (Sift output JSON: values and tables in full, charts as their data
   * series), when within RECORD_OUTPUTS_MAX_BYTES; null for notes, unrun cells, larger outputs and v0.
   */
  outputs: RunOutput[] | null;
  /** True when `outputs` holds every output of the run (so its digest can be recomputed from it). */
  outputsComplete: boolean;
  /** Size in bytes of the canonical JSON of all outputs (0 when there is no run). */
  outputsBytes: number;
  /** Claim cells: one entry per verdict, in order. */
  claims: RecordClaim[];
  /** Names of the uploads the cell reads (see `uploads`). */
  uploadsRead: string[];
}

/** An upload some cell reads: its upload fields (sha-256 of the file as uploaded) and what the cells read. */
export interface RecordUpload
  extends Pick<UploadView, 'name' | 'originalName' | 'kind' | 'mediaType' | 'sizeBytes' | 'sha256' | 'rowCount' | 'columns'> {
  /** The parsed content the cells read, when sizeBytes ≤ RECORD_UPLOAD_EMBED_MAX_BYTES; else null. */
  content: UploadContent | null;
}

export interface LockRecord {
  recordVersion: LockRecordVersion;
  notebookId: string;
  title: string;
  summary: string;
  tags: string[];
  authors: RecordAuthor[];
  notebookRevision: number;
  revisionDigest: string;
  digestVersion: string;
  lockedBy: UserRef;
  lockedAt: string;
  signers: LockSigner[];
  requiredSignoffs: number;
  /** Versions of the API process that locked (engine and Sift). */
  engineVersion: string;
  languageVersion: string;
  /** Distinct versions recorded on the cells' runs. */
  runEngineVersions: string[];
  runLanguageVersions: string[];
  cells: LockedCell[];
  uploads: RecordUpload[];
  /**
   * Hex SHA-256 of the UTF-8 canonical JSON (keys sorted, no whitespace; @cribra/lang canonicalJson)
   * of this record without the `recordSha256` field.
   */
  recordSha256: string;
}

/** One cell as `cribra verify` reports it. */
export interface RecordCheckCell {
  position: number;
  cellId: string;
  kind: string;
  title: string | null;
  status: Exclude<VerificationCellStatus, 'pending'>;
  recordedDigest: string | null;
  newDigest: string | null;
  note: string | null;
}
