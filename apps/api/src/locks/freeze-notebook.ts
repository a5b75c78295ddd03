import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { ENGINE_VERSION } from '@cribra/engine';
import { canonicalJson, LANG_VERSION } from '@cribra/lang';
import {
  LOCK_RECORD_VERSION,
  RECORD_OUTPUTS_MAX_BYTES,
  RECORD_UPLOAD_EMBED_MAX_BYTES,
  REVISION_DIGEST_VERSION,
  type LockRecord,
  type LockSigner,
  type RecordUpload,
  type RunOutput,
  type UploadContent,
} from '@cribra/contracts';
import { loadDigestCells, revisionDigestOf } from '../reviews/revision-digest';
import { stillReviewer } from '../reviews/still-reviewer';
import { recordClaims } from './record-claims';
import { withRecordSha256 } from './record-hash';
import { uploadsRead } from './record-uploads-read';

const distinct = (xs: Array<string | null>): string[] => [...new Set(xs.filter((x): x is string => !!x))].sort();
const iso = (d: Date | string | null): string | null => (d ? new Date(d).toISOString() : null);

/** The sign-offs valid on `digest`, each with the re-verification it rests on. */
async function loadSigners(m: EntityManager, notebookId: string, digest: string): Promise<LockSigner[]> {
  const rows: Array<{
    id: string; reviewer_id: string; reviewer_name: string; created_at: Date; verification_id: string | null; comment: string;
    revision_digest: string; v_digest: string | null; v_created: Date | null; v_finished: Date | null; rerun: number | null; same: number | null;
  }> = await m.query(
    `SELECT r.id, r.reviewer_id, u.display_name AS reviewer_name, r.created_at, r.verification_id, r.comment, r.revision_digest,
            v.revision_digest AS v_digest, v.created_at AS v_created, v.finished_at AS v_finished,
            (SELECT count(*)::int FROM verification_cells vc WHERE vc.verification_id = v.id AND vc.kind <> 'note') AS rerun,
            (SELECT count(*)::int FROM verification_cells vc JOIN runs x ON x.id = vc.run_id
              WHERE vc.verification_id = v.id AND vc.kind <> 'note' AND x.status = 'succeeded'
                AND x.output_digest IS NOT DISTINCT FROM vc.recorded_digest) AS same
       FROM reviews r JOIN users u ON u.id = r.reviewer_id
       LEFT JOIN verifications v ON v.id = r.verification_id
      WHERE r.notebook_id = $1 AND r.decision = 'signoff' AND r.voided_at IS NULL AND r.revision_digest = $2
        AND ${stillReviewer('r')}
      ORDER BY r.created_at`,
    [notebookId, digest],
  );
  return rows.map((s) => ({
    reviewId: s.id,
    user: { id: s.reviewer_id, displayName: s.reviewer_name },
    signedAt: new Date(s.created_at).toISOString(),
    verificationId: s.verification_id,
    comment: s.comment,
    revisionDigest: s.revision_digest,
    verification: s.verification_id && s.v_created
      ? {
          id: s.verification_id,
          revisionDigest: s.v_digest ?? '',
          startedAt: iso(s.v_created)!,
          finishedAt: iso(s.v_finished),
          cellsRerun: s.rerun ?? 0,
          cellsSame: s.same ?? 0,
        }
      : null,
  }));
}

/**
 * Writes the lock record of a notebook and sets it 'locked', inside the caller's transaction. The
 * record is self-contained (docs/records.md): notebook title, summary, authors, revision and
 * revision digest; per cell its kind, title, source, cell revision, recorded outputs (up to
 * RECORD_OUTPUTS_MAX_BYTES), output digest and versions, and for claims the verdicts with binders,
 * ranges, cases checked and counterexample; the uploads cells read (content embedded up to
 * RECORD_UPLOAD_EMBED_MAX_BYTES); the valid sign-offs on the digest with their re-verifications;
 * who locked and when; and its own SHA-256. Checks nothing (LocksService checks the rules first);
 * also used by the demo seed. Afterwards the database trigger freezes it all.
 */
export async function freezeNotebook(m: EntityManager, notebookId: string, lockedBy: string): Promise<LockRecord> {
  const [nb] = await m.query(`SELECT title, summary, tags, revision, required_signoffs FROM notebooks WHERE id = $1 FOR UPDATE`, [notebookId]);
  if (!nb) throw new Error(`notebook ${notebookId} does not exist`);
  const cells = await loadDigestCells(m, notebookId);
  const digest = revisionDigestOf(cells);
  const signers = await loadSigners(m, notebookId, digest);
  const authors: Array<{ id: string; display_name: string; role: 'owner' | 'editor' }> = await m.query(
    `SELECT u.id, u.display_name, nm.role FROM notebook_members nm JOIN users u ON u.id = nm.user_id
      WHERE nm.notebook_id = $1 AND nm.role IN ('owner', 'editor') ORDER BY nm.role = 'owner' DESC, u.display_name, u.id`,
    [notebookId],
  );
  const extra: Array<{ id: string; title: string | null; cell_revision: number | null; outputs: RunOutput[] | null }> = await m.query(
    `SELECT c.id, c.title, r.cell_revision, r.outputs FROM cells c
       LEFT JOIN runs r ON r.id = ANY($2::uuid[]) AND r.cell_id = c.id
      WHERE c.notebook_id = $1`,
    [notebookId, cells.map((c) => c.runId).filter(Boolean)],
  );
  const byId = new Map(extra.map((e) => [e.id, e]));
  const uploadRows: Array<{
    name: string; original_name: string; kind: RecordUpload['kind']; media_type: string; size_bytes: number; sha256: string;
    row_count: number; columns: string[] | null; content: UploadContent;
  }> = await m.query(
    `SELECT name, original_name, kind, media_type, size_bytes, sha256, row_count, columns, content FROM uploads WHERE notebook_id = $1 ORDER BY name`,
    [notebookId],
  );
  const uploadNames = uploadRows.map((u) => u.name);
  const [me] = await m.query(`SELECT display_name FROM users WHERE id = $1`, [lockedBy]);
  const [{ now }] = await m.query(`SELECT now() AS now`);

  const lockedCells = cells.map((c) => {
    const x = byId.get(c.id);
    const outputs = c.runId ? (x?.outputs ?? []) : null;
    const bytes = outputs ? Buffer.byteLength(canonicalJson(outputs), 'utf8') : 0;
    const complete = outputs !== null && bytes <= RECORD_OUTPUTS_MAX_BYTES;
    return {
      id: c.id,
      position: c.position,
      kind: c.kind,
      title: x?.title ?? null,
      sourceSha256: createHash('sha256').update(c.source, 'utf8').digest('hex'),
      source: c.source,
      cellRevision: c.runId ? (x?.cell_revision ?? null) : null,
      outputDigest: c.outputDigest,
      runId: c.runId,
      engineVersion: c.engineVersion,
      languageVersion: c.languageVersion,
      outputs: complete ? outputs : null,
      outputsComplete: complete,
      outputsBytes: bytes,
      claims: c.kind === 'claim' ? recordClaims(c.source, outputs) : [],
      uploadsRead: c.kind === 'note' ? [] : uploadsRead(c.source, uploadNames),
    };
  });
  const read = new Set(lockedCells.flatMap((c) => c.uploadsRead));
  const record = withRecordSha256({
    recordVersion: LOCK_RECORD_VERSION,
    notebookId,
    title: nb.title,
    summary: nb.summary,
    tags: nb.tags,
    authors: authors.map((a) => ({ id: a.id, displayName: a.display_name, role: a.role })),
    notebookRevision: nb.revision,
    revisionDigest: digest,
    digestVersion: REVISION_DIGEST_VERSION,
    lockedBy: { id: lockedBy, displayName: me?.display_name ?? '' },
    lockedAt: new Date(now).toISOString(),
    signers,
    requiredSignoffs: nb.required_signoffs,
    engineVersion: ENGINE_VERSION,
    languageVersion: LANG_VERSION,
    runEngineVersions: distinct(cells.map((c) => c.engineVersion)),
    runLanguageVersions: distinct(cells.map((c) => c.languageVersion)),
    cells: lockedCells,
    uploads: uploadRows
      .filter((u) => read.has(u.name))
      .map((u) => ({
        name: u.name,
        originalName: u.original_name,
        kind: u.kind,
        mediaType: u.media_type,
        sizeBytes: u.size_bytes,
        sha256: u.sha256,
        rowCount: u.row_count,
        columns: u.columns,
        content: u.size_bytes <= RECORD_UPLOAD_EMBED_MAX_BYTES ? u.content : null,
      })),
  });
  await m.query(
    `INSERT INTO notebook_locks (notebook_id, locked_by, locked_at, revision_digest, notebook_revision, record)
     VALUES ($1, $2, $3, $4, $5, $6)`,
    [notebookId, lockedBy, now, digest, nb.revision, JSON.stringify(record)],
  );
  await m.query(`UPDATE notebooks SET status = 'locked', updated_at = now() WHERE id = $1`, [notebookId]);
  return record;
}
