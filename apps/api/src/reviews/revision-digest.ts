import { createHash } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { REVISION_DIGEST_VERSION } from '@cribra/contracts';

/** One cell as the revision digest sees it, with the run whose output digest counts. */
export interface DigestCell {
  id: string;
  kind: string;
  position: number;
  source: string;
  outputDigest: string | null;
  runId: string | null;
  engineVersion: string | null;
  languageVersion: string | null;
}

/**
 * The cells of a notebook in position order, each with the latest succeeded ordinary run
 * (purpose 'run') of its current revision. Re-verification runs never count.
 */
export async function loadDigestCells(db: DataSource | EntityManager, notebookId: string): Promise<DigestCell[]> {
  const rows: Array<{
    id: string;
    kind: string;
    position: number;
    source: string;
    run_id: string | null;
    output_digest: string | null;
    engine_version: string | null;
    language_version: string | null;
  }> = await db.query(
    `SELECT c.id, c.kind, c.position, c.source, r.id AS run_id, r.output_digest, r.engine_version, r.language_version
       FROM cells c
       LEFT JOIN LATERAL (
         SELECT id, output_digest, engine_version, language_version FROM runs
          WHERE cell_id = c.id AND purpose = 'run' AND status = 'succeeded' AND cell_revision = c.revision
          ORDER BY finished_at DESC NULLS LAST, queued_at DESC LIMIT 1
       ) r ON true
      WHERE c.notebook_id = $1
      ORDER BY c.position`,
    [notebookId],
  );
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    position: r.position,
    source: r.source,
    outputDigest: r.output_digest,
    runId: r.run_id,
    engineVersion: r.engine_version,
    languageVersion: r.language_version,
  }));
}

/**
 * The revision digest of a notebook: hex SHA-256 of the UTF-8 text
 * `cribra-revision-v1\n` + JSON.stringify([[id, kind, position, source, outputDigest], …]) with the
 * cells in position order (outputDigest null when there is no succeeded ordinary run of the cell's
 * current revision). The only definition in the code base; documented in docs/permissions.md.
 */
export function revisionDigestOf(cells: readonly DigestCell[]): string {
  const canonical = JSON.stringify(cells.map((c) => [c.id, c.kind, c.position, c.source, c.outputDigest]));
  return createHash('sha256').update(`${REVISION_DIGEST_VERSION}\n${canonical}`, 'utf8').digest('hex');
}

export async function revisionDigest(db: DataSource | EntityManager, notebookId: string): Promise<string> {
  return revisionDigestOf(await loadDigestCells(db, notebookId));
}
