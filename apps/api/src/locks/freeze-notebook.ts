import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { ENGINE_VERSION } from '@cribra/engine';
import { LANG_VERSION } from '@cribra/lang';
import { REVISION_DIGEST_VERSION, type LockRecord } from '@cribra/contracts';
import { loadDigestCells, revisionDigestOf } from '../reviews/revision-digest';
import { stillReviewer } from '../reviews/still-reviewer';

const distinct = (xs: Array<string | null>): string[] => [...new Set(xs.filter((x): x is string => !!x))].sort();

/**
 * Writes the lock record of a notebook and sets it 'locked', inside the caller's transaction:
 * revision digest, signers = the valid sign-offs on that digest, versions, every cell. Checks
 * nothing (LocksService checks the rules first); also usable by the demo seed, which inserts a
 * notebook with cells, succeeded runs and sign-offs (reviews rows with the digest from
 * `revisionDigest`) and then calls this. Afterwards the database trigger freezes it all.
 */
export async function freezeNotebook(m: EntityManager, notebookId: string, lockedBy: string): Promise<LockRecord> {
  const [nb] = await m.query(`SELECT title, revision, required_signoffs FROM notebooks WHERE id = $1 FOR UPDATE`, [notebookId]);
  if (!nb) throw new Error(`notebook ${notebookId} does not exist`);
  const cells = await loadDigestCells(m, notebookId);
  const digest = revisionDigestOf(cells);
  const signoffs: Array<{ id: string; reviewer_id: string; reviewer_name: string; created_at: Date; verification_id: string | null; comment: string }> =
    await m.query(
      `SELECT r.id, r.reviewer_id, u.display_name AS reviewer_name, r.created_at, r.verification_id, r.comment
         FROM reviews r JOIN users u ON u.id = r.reviewer_id
        WHERE r.notebook_id = $1 AND r.decision = 'signoff' AND r.voided_at IS NULL AND r.revision_digest = $2
          AND ${stillReviewer('r')}
        ORDER BY r.created_at`,
      [notebookId, digest],
    );
  const [me] = await m.query(`SELECT display_name FROM users WHERE id = $1`, [lockedBy]);
  const [{ now }] = await m.query(`SELECT now() AS now`);
  const record: LockRecord = {
    notebookId,
    title: nb.title,
    notebookRevision: nb.revision,
    revisionDigest: digest,
    digestVersion: REVISION_DIGEST_VERSION,
    lockedBy: { id: lockedBy, displayName: me?.display_name ?? '' },
    lockedAt: new Date(now).toISOString(),
    signers: signoffs.map((s) => ({
      reviewId: s.id,
      user: { id: s.reviewer_id, displayName: s.reviewer_name },
      signedAt: new Date(s.created_at).toISOString(),
      verificationId: s.verification_id,
      comment: s.comment,
    })),
    requiredSignoffs: nb.required_signoffs,
    engineVersion: ENGINE_VERSION,
    languageVersion: LANG_VERSION,
    runEngineVersions: distinct(cells.map((c) => c.engineVersion)),
    runLanguageVersions: distinct(cells.map((c) => c.languageVersion)),
    cells: cells.map((c) => ({
      id: c.id,
      position: c.position,
      kind: c.kind,
      sourceSha256: createHash('sha256').update(c.source, 'utf8').digest('hex'),
      source: c.source,
      outputDigest: c.outputDigest,
      runId: c.runId,
      engineVersion: c.engineVersion,
      languageVersion: c.languageVersion,
    })),
  };
  await m.query(
    `INSERT INTO notebook_locks (notebook_id, locked_by, locked_at, revision_digest, notebook_revision, record)
     VALUES ($1, $2, $3, $4, $5, $6)`,
    [notebookId, lockedBy, now, digest, nb.revision, JSON.stringify(record)],
  );
  await m.query(`UPDATE notebooks SET status = 'locked', updated_at = now() WHERE id = $1`, [notebookId]);
  return record;
}
