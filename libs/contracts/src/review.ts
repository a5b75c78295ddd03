// Review and collaboration: e-mail invitations, comments, re-verification, reviews (sign-offs),
// locks and lock records, notebook duplication. Types and constants only.
import type { MemberRole, RunError, RunOutput, UserRef } from './notebooks';

/*
 * Routes (all under /api; POST/PUT/PATCH/DELETE need the CSRF header). Permissions: docs/permissions.md.
 *
 * Invitations
 *   GET    /api/notebooks/:id/invitations?status=pending|all     → InvitationView[]      (owner, admin)
 *   POST   /api/notebooks/:id/invitations   CreateInvitationBody → 201 InvitationView   (owner, admin)
 *   POST   /api/invitations/:id/resend                           → InvitationView       (new token, new 7 days)
 *   DELETE /api/invitations/:id                                  → 204 (revoke; the link stops working)
 *   GET    /api/invitations/token/:token          (no sign-in)   → InvitationPreview    (404 unknown, 410 used/revoked/expired)
 *   POST   /api/invitations/accept  AcceptInvitationBody (signed in) → AcceptInvitationResponse
 *   Sign-up with the token: POST /api/auth/signup { email, password, displayName, invitationToken }
 *   (the address must be the invited one) — the new account joins the notebook at once.
 *
 * Comments
 *   GET    /api/notebooks/:id/threads?status=open|resolved&cellId=  → CommentThreadView[]
 *   POST   /api/notebooks/:id/threads       CreateThreadBody     → 201 CommentThreadView
 *   POST   /api/threads/:id/comments        CreateCommentBody    → 201 CommentView
 *   PATCH  /api/comments/:id                UpdateCommentBody    → CommentView (your own only)
 *   POST   /api/threads/:id/resolve                              → CommentThreadView
 *   POST   /api/threads/:id/reopen                               → CommentThreadView
 *
 * Review
 *   GET    /api/notebooks/:id/review                             → ReviewStateView
 *   POST   /api/notebooks/:id/review/request  RequestReviewBody  → ReviewStateView (owner: draft → in_review)
 *   POST   /api/notebooks/:id/verifications                      → 202 VerificationView (re-verify every cell)
 *   GET    /api/notebooks/:id/verifications                      → VerificationSummary[] (newest first)
 *   GET    /api/verifications/:id                                → VerificationView (poll until status 'done')
 *   POST   /api/notebooks/:id/reviews       CreateReviewBody     → 201 ReviewView (reviewer: sign off / ask for changes)
 *   GET    /api/notebooks/:id/reviews                            → ReviewView[] (newest first, voided ones too)
 *
 * Lock
 *   POST   /api/notebooks/:id/lock                               → 201 LockRecord (owner, admin)
 *   GET    /api/notebooks/:id/lock                               → LockRecord (404 when not locked)
 *   GET    /api/notebooks/:id/lock/export?format=json|markdown   → attachment (application/json | text/markdown)
 *   POST   /api/notebooks/:id/lock/checks                        → 202 VerificationView (re-run against the lock record)
 *   POST   /api/notebooks/:id/duplicate     DuplicateNotebookBody → 201 { id } (a new draft you own)
 */

// ---------------------------------------------------------------- invitations

/** Roles an invitation can grant (the owner is never invited). */
export type InvitableRole = Exclude<MemberRole, 'owner'>;
export const INVITABLE_ROLES: readonly InvitableRole[] = ['editor', 'reviewer', 'viewer'];

/** Web page the invitation e-mail links to: `${PUBLIC_URL}${INVITATION_PATH}/<token>`. */
export const INVITATION_PATH = '/invitations';
/** An invitation link works once, within this many days of being sent (or resent). */
export const INVITATION_TTL_DAYS = 7;

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';

/**
 * Delivery of the e-mail: 'sending' (not tried yet or being tried), 'sent', 'retrying' (the SMTP
 * server refused or was down; tried again later with growing delay), 'failed' (gave up).
 */
export type InvitationDelivery = 'sending' | 'sent' | 'retrying' | 'failed';

export interface InvitationView {
  id: string;
  notebookId: string;
  email: string;
  role: InvitableRole;
  status: InvitationStatus;
  delivery: InvitationDelivery;
  /** Sending attempts so far. */
  deliveryAttempts: number;
  /** Last SMTP error, when delivery is 'retrying' or 'failed'. */
  deliveryError: string | null;
  nextAttemptAt: string | null;
  sentAt: string | null;
  invitedBy: UserRef;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
  acceptedBy: UserRef | null;
  revokedAt: string | null;
}

export interface CreateInvitationBody {
  email: string;
  role: InvitableRole;
  /** Optional personal note included in the e-mail (plain text, at most 1000 characters). */
  message?: string;
}

/** What the invitation page shows before the person signs in or creates an account. */
export interface InvitationPreview {
  notebookId: string;
  notebookTitle: string;
  role: InvitableRole;
  /** The invited address; sign-up and accept must use an account with this address. */
  email: string;
  invitedBy: UserRef;
  expiresAt: string;
  /** True when an account with the invited address exists (then: sign in, else: create an account). */
  accountExists: boolean;
}

export interface AcceptInvitationBody {
  token: string;
}

export interface AcceptInvitationResponse {
  notebookId: string;
  role: MemberRole;
}

/** Details of a refused token (404 unknown, 410 gone, 403 wrong account). */
export interface InvitationTokenErrorDetails {
  reason: 'unknown' | 'accepted' | 'revoked' | 'expired' | 'wrong_account';
}

// ---------------------------------------------------------------- comments

/** Where a thread is attached: the whole notebook, one cell, or one output of a cell's run. */
export type CommentAnchor =
  | { kind: 'notebook' }
  | { kind: 'cell'; cellId: string }
  /** `outputIndex` is the index in the run's `outputs`; `runId` the run that showed it. */
  | { kind: 'output'; cellId: string; runId: string; outputIndex: number };

export type ThreadStatus = 'open' | 'resolved';
export const COMMENT_BODY_MAX = 20_000;

export interface CommentView {
  id: string;
  threadId: string;
  author: UserRef;
  /** Markdown source with math ($…$, $$…$$); the web renders it sanitised. */
  body: string;
  mentions: UserRef[];
  createdAt: string;
  /** Set once the author edited the comment. */
  editedAt: string | null;
}

export interface CommentThreadView {
  id: string;
  notebookId: string;
  anchor: CommentAnchor;
  status: ThreadStatus;
  createdBy: UserRef;
  createdAt: string;
  resolvedBy: UserRef | null;
  resolvedAt: string | null;
  /** Oldest first; the first one opened the thread. */
  comments: CommentView[];
}

export interface CreateThreadBody {
  anchor: CommentAnchor;
  body: string;
  /** User ids of members to tell by e-mail (the web inserts "@Name" in the text and sends the ids). */
  mentions?: string[];
}

export interface CreateCommentBody {
  body: string;
  mentions?: string[];
}

export interface UpdateCommentBody {
  body: string;
  /** Members newly mentioned are told by e-mail; already mentioned ones are not told again. */
  mentions?: string[];
}

// ---------------------------------------------------------------- revision digest

/**
 * Version tag of the revision digest. The digest is the hex sha-256 of the UTF-8 text
 * `cribra-revision-v1\n` + JSON.stringify(cells) where cells is, in position order, one array per
 * cell: [id, kind, position, source, outputDigest] and outputDigest is the output digest of the
 * latest succeeded ordinary run ('run' purpose) of the cell's current revision, or null (note cells,
 * never run, only failed runs). Re-verification runs never change it. See docs/permissions.md.
 */
export const REVISION_DIGEST_VERSION = 'cribra-revision-v1';

// ---------------------------------------------------------------- verification (re-verify)

/**
 * Per cell: 'pending' (still running), 'same' (new digest = recorded digest), 'differs' (with both
 * outputs), 'failed' (the new run failed or was cancelled), 'skipped' (note cells).
 */
export type VerificationCellStatus = 'pending' | 'same' | 'differs' | 'failed' | 'skipped';
export type VerificationStatus = 'running' | 'done';
/** 'review': re-verify during review; 'lock': a check of a locked notebook against its lock record. */
export type VerificationPurpose = 'review' | 'lock';

export interface VerificationCellResult {
  cellId: string;
  position: number;
  kind: string;
  status: VerificationCellStatus;
  /** Digest recorded on the notebook (or in the lock record) before the re-run. */
  recordedDigest: string | null;
  /** Digest of the re-run; null until it succeeded. */
  newDigest: string | null;
  /** Why it differs, e.g. 'outputs differ' or 'the recorded outputs do not match their recorded digest'. */
  note: string | null;
  /** Filled when status is 'differs': both outputs side by side. */
  recordedOutputs: RunOutput[] | null;
  newOutputs: RunOutput[] | null;
  /** The re-run (purpose 'reverify'). */
  runId: string | null;
  error: RunError | null;
}

export interface VerificationSummary {
  id: string;
  notebookId: string;
  purpose: VerificationPurpose;
  status: VerificationStatus;
  /** Revision digest of the notebook when the re-verify started. */
  revisionDigest: string;
  requestedBy: UserRef;
  createdAt: string;
  finishedAt: string | null;
  counts: Record<VerificationCellStatus, number>;
  /** True when done and every executable cell is 'same'. */
  allSame: boolean;
  engineVersion: string | null;
  languageVersion: string | null;
}

export interface VerificationView extends VerificationSummary {
  cells: VerificationCellResult[];
}

// ---------------------------------------------------------------- reviews and sign-offs

export type ReviewDecision = 'signoff' | 'changes_requested';

export interface ReviewView {
  id: string;
  notebookId: string;
  reviewer: UserRef;
  decision: ReviewDecision;
  comment: string;
  /** The revision digest the decision binds to. */
  revisionDigest: string;
  notebookRevision: number;
  verificationId: string | null;
  createdAt: string;
  /** A sign-off is void once the notebook's revision digest moved on. */
  voidedAt: string | null;
  voidReason: string | null;
  /** signoff, not voided, bound to the current revision digest, by someone still a reviewer of the notebook. */
  valid: boolean;
}

export interface RequestReviewBody {
  /** Optional note to the reviewers (e-mailed to them). */
  message?: string;
}

export interface CreateReviewBody {
  decision: ReviewDecision;
  /** Markdown; required (at least one non-space character). */
  comment: string;
  /** The revision digest the reviewer looked at; 409 when the notebook changed since. */
  revisionDigest: string;
  /**
   * Required for 'signoff': a finished re-verify of this same revision digest, started by the
   * reviewer, in which every executable cell is 'same'.
   */
  verificationId?: string;
}

export interface ReviewStateView {
  notebookId: string;
  status: 'draft' | 'in_review' | 'locked';
  notebookRevision: number;
  revisionDigest: string;
  requiredSignoffs: number;
  /** Valid sign-offs on the current revision digest. */
  validSignoffs: ReviewView[];
  /** True when the owner (or an admin) may lock now. */
  canLock: boolean;
  /** What stands in the way of locking, in words (empty when canLock). */
  lockBlockers: string[];
  latestVerification: VerificationSummary | null;
  reviewRequestedAt: string | null;
}

/** 409 details when a review names a revision digest that is no longer current. */
export interface StaleDigestDetails {
  reason: 'stale_digest';
  revisionDigest: string;
}

// ---------------------------------------------------------------- lock records

// The lock record itself (LockRecord and its parts) is defined in ./lock-record.ts.

export type LockExportFormat = 'json' | 'markdown';

export interface DuplicateNotebookBody {
  /** Default: the original title with " (copy)". */
  title?: string;
}

export interface DuplicateNotebookResponse {
  id: string;
}
