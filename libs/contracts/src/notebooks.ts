// Notebooks, members, cells, runs, stored wheel levels, prime ledger, uploads, exports, audit.
// Types and constants only. Values that can exceed 2^53 (moduli, totients, counts, range ends)
// travel as decimal strings; gaps and positions are plain numbers.

/*
 * Routes (all under /api, signed in; POST/PUT/PATCH/DELETE need the CSRF header):
 *   GET    /api/notebooks?q&tag&status&role&page&pageSize   → Page<NotebookSummary>
 *   POST   /api/notebooks                 CreateNotebookBody → 201 NotebookView
 *   GET    /api/notebooks/:id                                → NotebookView (cells with latest runs, members)
 *   PATCH  /api/notebooks/:id             UpdateNotebookBody → NotebookView  (409 stale revision)
 *   DELETE /api/notebooks/:id                                → 204           (owner only)
 *   GET    /api/notebooks/:id/members                        → MemberView[]
 *   POST   /api/notebooks/:id/members     AddMemberBody      → 201 MemberView (existing user, by e-mail)
 *   PATCH  /api/notebooks/:id/members/:userId UpdateMemberBody → MemberView
 *   DELETE /api/notebooks/:id/members/:userId                → 204
 *   POST   /api/notebooks/:id/cells       CreateCellBody     → 201 CellView
 *   GET    /api/cells/:id                                    → CellView
 *   PUT    /api/cells/:id                 UpdateCellBody     → CellView (409 StaleCellDetails)
 *   DELETE /api/cells/:id?revision=N                         → 204      (409 StaleCellDetails)
 *   PUT    /api/notebooks/:id/cells/order ReorderCellsBody   → CellView[] (409 StaleOrderDetails)
 *   POST   /api/cells/:id/runs                               → 202 RunView
 *   POST   /api/notebooks/:id/runs                           → 202 RunAllResponse (every query/claim cell, in order)
 *   GET    /api/cells/:id/runs?page&pageSize                 → Page<RunView>  (history, newest first)
 *   GET    /api/notebooks/:id/runs?page&pageSize             → Page<RunView>
 *   GET    /api/runs/:id                                     → RunView
 *   POST   /api/runs/:id/cancel                              → RunView
 *   GET    /api/notebooks/:id/events     (text/event-stream) → NotebookEvent messages
 *   GET    /api/runs/:id/events          (text/event-stream) → NotebookEvent messages for one run
 *   GET    /api/levels                                       → WheelLevelSummary[]
 *   GET    /api/levels/:prime                                → WheelLevelView (404 when never requested)
 *   POST   /api/levels/:prime/computations                   → 202 ComputationView
 *   GET    /api/ledger/blocks?from&to&page&pageSize          → Page<LedgerBlockSummary>
 *   GET    /api/ledger/blocks/:index                         → LedgerBlockView
 *   GET    /api/ledger/range?from&to                         → LedgerRangeView (from stored blocks only)
 *   POST   /api/ledger/computations       LedgerComputationBody → 202 ComputationView
 *   GET    /api/computations?kind&status                     → ComputationView[]
 *   GET    /api/computations/:id                             → ComputationView
 *   GET    /api/runners                                      → RunnerView[] (heartbeats of runner processes)
 *   GET    /api/notebooks/:id/uploads                        → UploadView[]
 *   POST   /api/notebooks/:id/uploads   multipart: file, name? → 201 UploadView (400 UploadParseDetails)
 *   GET    /api/uploads/:id                                  → UploadView
 *   GET    /api/uploads/:id/content                          → UploadContent
 *   DELETE /api/uploads/:id                                  → 204
 *   GET    /api/notebooks/:id/export?format=markdown|latex|sift → text/markdown | application/x-latex | text/plain (.sift) (attachment)
 *   POST   /api/notebooks/import    multipart: file (.sift)  → 201 NotebookView (400 NotebookImportDetails; nothing stored)
 *   GET    /api/runs/:id/outputs/:index/export?format=csv|json → text/csv | application/json (table outputs)
 *   GET    /api/uploads/:id/export?format=csv|json           → text/csv | application/json
 *   GET    /api/notebooks/:id/audit                          → AuditEventView[] (owner, admin)
 * OpenAPI document: /api/docs
 */

export type NotebookStatus = 'draft' | 'in_review' | 'locked';
export const NOTEBOOK_STATUSES: readonly NotebookStatus[] = ['draft', 'in_review', 'locked'];

export type MemberRole = 'owner' | 'editor' | 'reviewer' | 'viewer';
export const MEMBER_ROLES: readonly MemberRole[] = ['owner', 'editor', 'reviewer', 'viewer'];

export type CellKind = 'query' | 'claim' | 'note';
export const CELL_KINDS: readonly CellKind[] = ['query', 'claim', 'note'];

export type RunStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
export const RUN_STATUSES: readonly RunStatus[] = ['queued', 'running', 'succeeded', 'failed', 'cancelled'];
/** Runs in these states can still change. */
export const ACTIVE_RUN_STATUSES: readonly RunStatus[] = ['queued', 'running'];

/** Why a run was made: an ordinary run, or a re-verification (issued by the review feature). */
export type RunPurpose = 'run' | 'reverify';

export const NOTEBOOK_TITLE_MAX = 200;
export const NOTEBOOK_SUMMARY_MAX = 4000;
export const NOTEBOOK_TAGS_MAX = 20;
export const NOTEBOOK_TAG_MAX = 40;
export const CELL_SOURCE_MAX = 100_000;
/** A cell title is one line of at most this many characters. */
export const CELL_TITLE_MAX = 200;

/** One page of a list. `page` counts from 1. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

// ---------------------------------------------------------------- notebooks

export interface NotebookListQuery {
  /** Words searched in title, summary and tags (PostgreSQL full text, plus a title prefix match). */
  q?: string;
  tag?: string;
  status?: NotebookStatus;
  /** Only notebooks where the signed-in user has this role. */
  role?: MemberRole;
  page?: number;
  /** 1..100, default 20. */
  pageSize?: number;
}

export interface NotebookSummary {
  id: string;
  title: string;
  summary: string;
  tags: string[];
  status: NotebookStatus;
  /** Bumped by every change to the notebook or its cells (content, order, kind). */
  revision: number;
  requiredSignoffs: number;
  owner: UserRef;
  /** The signed-in user's role; null for an admin who is not a member. */
  myRole: MemberRole | null;
  cellCount: number;
  createdAt: string;
  updatedAt: string;
}

export interface NotebookView extends NotebookSummary {
  cells: CellView[];
  members: MemberView[];
}

export interface CreateNotebookBody {
  title: string;
  summary?: string;
  tags?: string[];
  /** Default 1. */
  requiredSignoffs?: number;
}

export interface UpdateNotebookBody {
  /** The notebook revision the edit started from; a stale one gets 409 with StaleNotebookDetails. */
  revision: number;
  title?: string;
  summary?: string;
  tags?: string[];
  requiredSignoffs?: number;
}

export interface StaleNotebookDetails {
  reason: 'stale_revision';
  current: NotebookSummary;
}

/** 409 details when a change is refused because the notebook is locked. */
export interface LockedNotebookDetails {
  reason: 'notebook_locked';
  notebookId: string;
}

export interface UserRef {
  id: string;
  displayName: string;
}

// ---------------------------------------------------------------- members

export interface MemberView {
  userId: string;
  email: string;
  displayName: string;
  role: MemberRole;
  addedAt: string;
}

export interface AddMemberBody {
  email: string;
  role: Exclude<MemberRole, 'owner'>;
}

export interface UpdateMemberBody {
  role: Exclude<MemberRole, 'owner'>;
}

// ---------------------------------------------------------------- cells

export interface CellView {
  id: string;
  notebookId: string;
  kind: CellKind;
  /** Optional heading of the cell (one line); not part of the revision digest. */
  title: string | null;
  source: string;
  /** 0-based, dense within a notebook. */
  position: number;
  /** Bumped by each change of source or kind. */
  revision: number;
  author: UserRef;
  createdAt: string;
  updatedAt: string;
  /** Latest run of any revision of this cell (check `latestRun.cellRevision` against `revision`). */
  latestRun: RunView | null;
}

export interface CreateCellBody {
  kind: CellKind;
  source: string;
  /** One line, at most CELL_TITLE_MAX characters; blank means none. */
  title?: string | null;
  /** Insert before the cell now at this position; default: append. */
  position?: number;
}

export interface UpdateCellBody {
  /** The cell revision the edit started from. */
  revision: number;
  source?: string;
  kind?: CellKind;
  /** A new title; null or blank removes it. A title alone does not bump the cell revision. */
  title?: string | null;
}

/** 409 details for a stale cell edit or delete. */
export interface StaleCellDetails {
  reason: 'stale_revision';
  current: CellView;
}

export interface ReorderCellsBody {
  /** Notebook revision the reorder started from. */
  revision: number;
  /** Every cell id of the notebook, exactly once, in the new order. */
  cellIds: string[];
}

export interface StaleOrderDetails {
  reason: 'stale_revision';
  revision: number;
  cells: CellView[];
}

// ---------------------------------------------------------------- runs

/**
 * One typed output of a Sift cell, as JSON. The exact variants are defined by @cribra/lang;
 * every variant has a `kind` (e.g. 'value', 'table', 'chart', 'verdict', 'text').
 * Tables have `columns: string[]` and `rows: unknown[][]`.
 */
export interface RunOutput {
  kind: string;
  [key: string]: unknown;
}

export type RunErrorKind = 'syntax' | 'type' | 'domain' | 'runtime' | 'limit' | 'input' | 'cancelled' | 'internal';

/**
 * Largest size of one run's outputs, as stored (their JSON, UTF-8), checked by the runner before
 * storing; a run above it fails with a `limit` error carrying `limit` (runners may lower or raise
 * it with CRIBRA_RUN_OUTPUT_MAX_BYTES).
 */
export const RUN_OUTPUT_MAX_BYTES = 4 * 1024 * 1024;

/** Largest stored size of a run's outputs carried inline by a notebook read (larger: `outputsOmitted`). */
export const NOTEBOOK_INLINE_OUTPUT_BYTES = 64 * 1024;

/** Which limit a `limit` error hit, with the sizes (so a client can say "12.3 MB of 4 MB"). */
export interface RunLimitDetails {
  name: 'run_output_bytes';
  maxBytes: number;
  sizeBytes: number;
}

export interface RunError {
  kind: RunErrorKind;
  message: string;
  /** Set on a `limit` error raised outside the language (the per-run output size). */
  limit?: RunLimitDetails;
  /** 1-based source position, when the error has one. */
  line?: number;
  column?: number;
}

export interface RunView {
  id: string;
  notebookId: string;
  cellId: string;
  cellRevision: number;
  purpose: RunPurpose;
  status: RunStatus;
  /** 0..1. */
  progress: number;
  /** Short human note from the runner ("block 3 of 10"). */
  progressNote: string | null;
  outputs: RunOutput[] | null;
  /**
   * Set in a notebook read (GET /api/notebooks/:id) when this run's stored outputs are larger than
   * NOTEBOOK_INLINE_OUTPUT_BYTES: `outputs` is then null and the outputs are fetched with
   * GET /api/runs/:id, so one heavy run does not make every read of its notebook heavy.
   */
  outputsOmitted?: boolean;
  /** Canonical digest of the outputs (hex sha-256 from @cribra/lang), set when succeeded. */
  outputDigest: string | null;
  engineVersion: string | null;
  languageVersion: string | null;
  runnerId: string | null;
  /** How many times a runner started this run (more than 1 after a runner died). */
  attempts: number;
  requestedBy: UserRef;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  error: RunError | null;
}

export interface RunAllResponse {
  runs: RunView[];
}

/** Server-sent events on /api/notebooks/:id/events (event name = `type`). */
export type NotebookEvent =
  | { type: 'run'; run: RunProgressEvent }
  | { type: 'notebook'; notebookId: string; revision: number }
  | { type: 'state'; notebookId: string; topic: NotebookStateTopic };

/**
 * What changed when a `state` event arrives (no revision moves with these): the status (review
 * asked, changes asked, locked), a review request, a re-verification, a review (sign-off, or one
 * voided), the lock record, members or invitations.
 */
export type NotebookStateTopic = 'status' | 'review' | 'verification' | 'lock' | 'members' | 'presence';

/*
 * Presence (who has the notebook open, and on which cell their editor has the focus):
 *   GET    /api/notebooks/:id/presence                        → PresenceView[]
 *   PUT    /api/notebooks/:id/presence   UpdatePresenceBody    → PresenceView[] (a tab's heartbeat)
 *   DELETE /api/notebooks/:id/presence/:tabId                 → 204 (the tab closed)
 * Changes arrive as `state` events with topic 'presence'.
 */
export interface UpdatePresenceBody {
  tabId: string;
  cellId?: string | null;
}
export interface PresenceView {
  user: UserRef;
  editingCellId: string | null;
}
/** A tab sends a heartbeat every PRESENCE_BEAT_MS; one quiet for PRESENCE_QUIET_MS counts as gone. */
export const PRESENCE_BEAT_MS = 10_000;
export const PRESENCE_QUIET_MS = 30_000;

/** Small form of a run update; fetch GET /api/runs/:id for the outputs once `status` is final. */
export interface RunProgressEvent {
  id: string;
  notebookId: string;
  cellId: string;
  status: RunStatus;
  progress: number;
  progressNote: string | null;
  outputDigest: string | null;
}

// ---------------------------------------------------------------- computations (chunked jobs)

export type ComputationKind = 'level' | 'ledger';
export type ComputationStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
export const ACTIVE_COMPUTATION_STATUSES: readonly ComputationStatus[] = ['queued', 'running'];

export interface ComputationView {
  id: string;
  kind: ComputationKind;
  /** level: { prime }; ledger: { from, to } (decimal strings). */
  params: Record<string, string | number>;
  status: ComputationStatus;
  chunksTotal: number;
  chunksDone: number;
  requestedBy: UserRef | null;
  createdAt: string;
  /** When a runner planned it (its chunks were queued); elapsed time counts from here. */
  startedAt: string | null;
  finishedAt: string | null;
  error: string | null;
}

/**
 * Measured costs behind the Data page's estimates (docs/scaling.md, "Measured costs"): one runner
 * slot on the 2-core development machine under the load of parallel work. A request estimated
 * above ESTIMATE_CONFIRM_MS asks for confirmation first.
 */
export const COSTS = {
  /** Ledger blocks 0–99 (up to 10^9) as one computation, one runner with one slot: 8.3 s. */
  ledgerBlockMs: 83,
  /**
   * Whole wheel levels, request → stored, one runner slot (31#: 12.5 s; 37#: 261 s). Levels up to 29
   * take under a second. 41#, 43#, 47# go by the split route (SPLIT_ROUTE_FROM): the engine's bench
   * measured 1.4–2.9 s, 3.8–4.3 s and 16.6–19.0 s of wall time for them on a loaded machine
   * (docs/benchmarks.md); the figures here round those up, as bench figures, not request → stored.
   */
  levelMs: { 31: 12_500, 37: 261_000, 41: 3_000, 43: 5_000, 47: 20_000 } as Record<number, number>,
} as const;
export const ESTIMATE_CONFIRM_MS = 60_000;

/**
 * Cancel a computation:
 *   POST /api/computations/:id/cancel → ComputationView (status 'cancelled'; 409 when already finished)
 * Whoever may start computations (any signed-in user) may cancel them. Runners skip the chunks not
 * yet begun; blocks and chunks already stored are kept.
 */
export type CancelComputationResponse = ComputationView;

/** A runner process as its heartbeats show it. */
export interface RunnerView {
  id: string;
  host: string;
  pid: number;
  startedAt: string;
  lastSeenAt: string;
  /** `queue:jobId` of the job it is executing, or null when idle. */
  currentJob: string | null;
  jobsDone: number;
  stoppedAt: string | null;
  /** Not stopped, not taken over and seen within the last 30 seconds. */
  alive: boolean;
  /** When a live runner took its work over after its heartbeat stopped (null: never). */
  takenOverAt?: string | null;
  /** The runner that took its work over. */
  takenOverBy?: string | null;
}

// ---------------------------------------------------------------- stored wheel levels

export type LevelStatus = 'pending' | 'computing' | 'stored' | 'failed' | 'cancelled';

/** Largest wheel level computed at first start (all levels 2..23). */
export const LEVELS_SEEDED_UP_TO = 23;

export interface GapCount {
  gap: number;
  /** Decimal string. */
  count: string;
}

/** Tallies of runs of `length` consecutive gaps in the reduced residue system. */
export interface PatternTally {
  length: number;
  entries: Array<{ pattern: number[]; count: string }>;
}

export interface WheelLevelSummary {
  /** The prime p of the level p#. */
  prime: number;
  /** p# as a decimal string. */
  modulus: string;
  /** φ(p#) as a decimal string. */
  phi: string;
  largestGap: number | null;
  status: LevelStatus;
  digest: string | null;
  computationId: string | null;
  chunksTotal: number;
  chunksDone: number;
  computedBy: string | null;
  computedAt: string | null;
  engineVersion: string | null;
}

/** Deepest wheel level the runners compute and store. */
export const MAX_STORED_LEVEL = 47;
/**
 * Stored levels from this prime on are computed by the split route: chunks of the members of a
 * base level (19# up to 43#, 23# for 47#), each adding counts of every gap; no pattern tallies.
 */
export const SPLIT_ROUTE_FROM = 41;

export interface WheelLevelView extends WheelLevelSummary {
  histogram: GapCount[];
  patternTallies: PatternTally[];
}

// ---------------------------------------------------------------- prime ledger

/** Fixed width of one ledger block: block i covers [i·W, (i+1)·W). */
export const LEDGER_BLOCK_SIZE = 10_000_000;
/** Largest end the ledger accepts (exclusive), as a decimal string. */
export const LEDGER_MAX_END = '100000000000';

/**
 * The constellations every ledger block counts (n with n + h prime for all h), keyed by the name
 * used in `constellations`. All are admissible; counted when the whole pattern lies in the block.
 */
export const LEDGER_CONSTELLATIONS: Readonly<Record<string, readonly number[]>> = {
  twin: [0, 2],
  cousin: [0, 4],
  sexy: [0, 6],
  'triplet-0-2-6': [0, 2, 6],
  'triplet-0-4-6': [0, 4, 6],
  quadruplet: [0, 2, 6, 8],
};

export interface RecordGap {
  gap: number;
  /** The prime that starts the gap, decimal string. */
  start: string;
}

export interface LedgerBlockSummary {
  index: number;
  /** Inclusive start, exclusive end; decimal strings. */
  start: string;
  end: string;
  /** π(end-1) − π(start-1), decimal string. */
  primeCount: string;
  firstPrime: string | null;
  lastPrime: string | null;
  digest: string;
  computedBy: string | null;
  computedAt: string;
  engineVersion: string;
}

export interface LedgerBlockView extends LedgerBlockSummary {
  /** Gaps between consecutive primes inside the block. */
  gapHistogram: GapCount[];
  /** Counts of the usual constellations starting in the block, keyed by name (e.g. 'twin'). */
  constellations: Record<string, string>;
  /** Maximal gaps inside the block (each larger than every earlier one in the block). */
  recordGaps: RecordGap[];
}

/** Statistics of [from, to) combined from stored blocks. */
export interface LedgerRangeView {
  from: string;
  to: string;
  complete: boolean;
  /** Block indexes of the range not yet stored (then the other fields are null). */
  missingBlocks: number[];
  primeCount: string | null;
  gapHistogram: GapCount[] | null;
  constellations: Record<string, string> | null;
  largestGap: RecordGap | null;
}

export interface LedgerComputationBody {
  /** Decimal strings, 0 <= from < to <= LEDGER_MAX_END; the range is widened to whole blocks. */
  from: string;
  to: string;
}

// ---------------------------------------------------------------- uploads

export type UploadKind = 'tuples' | 'table';
export const UPLOAD_MAX_BYTES = 2 * 1024 * 1024;
/** Tuple files: one integer per line, `#` starts a comment; .txt. Tables: .csv with a header row. */
export const UPLOAD_EXTENSIONS: Record<UploadKind, string[]> = { tuples: ['.txt', '.tuples'], table: ['.csv'] };
/** Names a Sift cell uses to read an upload: letters, digits, `_`, `-`, `.`; starts with a letter. */
export const UPLOAD_NAME_PATTERN = '^[A-Za-z][A-Za-z0-9_.-]{0,63}$';

export interface UploadView {
  id: string;
  notebookId: string;
  name: string;
  originalName: string;
  kind: UploadKind;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  rowCount: number;
  /** Column names of a table; null for tuples. */
  columns: string[] | null;
  owner: UserRef;
  createdAt: string;
}

export type UploadContent =
  | { kind: 'tuples'; values: string[] }
  | { kind: 'table'; columns: string[]; rows: string[][] };

/** 400 details of a refused upload. */
export interface UploadParseDetails {
  reason: 'parse_error' | 'too_large' | 'bad_type' | 'empty' | 'duplicate_name' | 'bad_name';
  errors: Array<{ line: number; message: string }>;
}

// ---------------------------------------------------------------- exports

export type NotebookExportFormat = 'markdown' | 'latex' | 'sift';

/** A notebook file (`.sift`) is read with the limits of uploads: at most UPLOAD_MAX_BYTES, UTF-8 text. */
export const NOTEBOOK_FILE_EXTENSIONS: readonly string[] = ['.sift', '.txt'];

/** 400 details of a refused notebook file (POST /api/notebooks/import): nothing was stored. */
export interface NotebookImportDetails {
  reason: 'parse_error' | 'too_large' | 'bad_type' | 'empty' | 'invalid';
  /** 1-based line of the file with its problem. */
  errors: Array<{ line: number; message: string }>;
}
export type TableExportFormat = 'csv' | 'json';

// ---------------------------------------------------------------- audit

export interface AuditEventView {
  id: string;
  at: string;
  actor: UserRef | null;
  notebookId: string | null;
  /** Dotted action name, e.g. 'notebook.create', 'member.add', 'export.markdown'. */
  action: string;
  details: Record<string, unknown>;
}
