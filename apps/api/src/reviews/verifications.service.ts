import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { outputsDigest, type SiftOutput } from '@cribra/lang';
import type {
  RunError,
  RunOutput,
  RunStatus,
  VerificationCellResult,
  VerificationCellStatus,
  VerificationPurpose,
  VerificationSummary,
  VerificationView,
} from '@cribra/contracts';
import type { Actor } from '../members/notebook-policy.service';
import { RunsService } from '../runs/runs.service';
import { loadDigestCells, revisionDigestOf, type DigestCell } from './revision-digest';

interface HeadRow {
  id: string;
  notebook_id: string;
  purpose: VerificationPurpose;
  revision_digest: string;
  requested_by: string;
  requester_name: string;
  created_at: Date;
  finished_at: Date | null;
}

interface CellRow {
  cell_id: string;
  position: number;
  kind: string;
  recorded_run_id: string | null;
  recorded_digest: string | null;
  run_id: string | null;
  status: RunStatus | null;
  outputs: RunOutput[] | null;
  output_digest: string | null;
  error: RunError | null;
  engine_version: string | null;
  language_version: string | null;
  recorded_outputs: RunOutput[] | null;
}

const FINAL: ReadonlySet<RunStatus> = new Set(['succeeded', 'failed', 'cancelled']);
const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

/** Canonical digest of stored outputs, or null when they cannot be digested. */
function digestOfStored(outputs: RunOutput[] | null): string | null {
  if (!outputs) return null;
  try {
    return outputsDigest(outputs as unknown as SiftOutput[]);
  } catch {
    return null;
  }
}

/** Compares one re-run with what was recorded. */
export function judgeCell(r: CellRow): VerificationCellResult {
  const base: VerificationCellResult = {
    cellId: r.cell_id,
    position: r.position,
    kind: r.kind,
    status: 'pending',
    recordedDigest: r.recorded_digest,
    newDigest: r.status === 'succeeded' ? r.output_digest : null,
    note: null,
    recordedOutputs: null,
    newOutputs: null,
    runId: r.run_id,
    error: null,
  };
  if (r.kind === 'note') return { ...base, status: 'skipped' };
  if (!r.run_id || !r.status) return { ...base, status: 'failed', note: 'the re-run could not be queued' };
  if (!FINAL.has(r.status)) return base;
  if (r.status !== 'succeeded') {
    return { ...base, status: 'failed', error: r.error, note: r.status === 'cancelled' ? 'the re-run was cancelled' : 'the re-run failed' };
  }
  const both = { recordedOutputs: r.recorded_outputs, newOutputs: r.outputs };
  if (r.recorded_digest === null) return { ...base, ...both, status: 'differs', note: 'no recorded output to compare with' };
  if (r.output_digest !== r.recorded_digest) return { ...base, ...both, status: 'differs', note: 'outputs differ' };
  // Same digest: also make sure the stored outputs still are what the recorded digest says.
  if (r.recorded_outputs && digestOfStored(r.recorded_outputs) !== r.recorded_digest) {
    return { ...base, ...both, status: 'differs', note: 'the recorded outputs do not match their recorded digest' };
  }
  return { ...base, status: 'same' };
}

/** What a verification compares against, per cell id (defaults: the notebook's digest cells). */
export interface Recorded {
  revisionDigest: string;
  cells: DigestCell[];
}

/**
 * Re-verify: re-run every cell from its source through the ordinary queue and runners (runs with
 * purpose 'reverify', which never change the revision digest) and compare each output digest
 * with the recorded one.
 */
@Injectable()
export class VerificationsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly runs: RunsService,
  ) {}

  async notebookOf(id: string): Promise<string> {
    const rows: Array<{ notebook_id: string }> = await this.db.query(`SELECT notebook_id FROM verifications WHERE id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Verification not found');
    return rows[0].notebook_id;
  }

  async start(actor: Actor, notebookId: string, purpose: VerificationPurpose, recorded?: Recorded): Promise<VerificationView> {
    const cells = recorded?.cells ?? (await loadDigestCells(this.db, notebookId));
    const digest = recorded?.revisionDigest ?? revisionDigestOf(cells);
    const [{ id }] = await this.db.query(
      `INSERT INTO verifications (notebook_id, purpose, revision_digest, requested_by) VALUES ($1, $2, $3, $4) RETURNING id`,
      [notebookId, purpose, digest, actor.id],
    );
    for (const c of cells) {
      let runId: string | null = null;
      if (c.kind !== 'note') {
        try {
          runId = (await this.runs.runCell(actor, c.id, 'reverify')).id;
        } catch {
          runId = null; // reported as 'failed' (could not be queued)
        }
      }
      await this.db.query(
        `INSERT INTO verification_cells (verification_id, cell_id, position, kind, recorded_run_id, recorded_digest, run_id)
         VALUES ($1, $2, $3, $4, $5, $6, $7)`,
        [id, c.id, c.position, c.kind, c.runId, c.outputDigest, runId],
      );
    }
    return this.get(id);
  }

  private async heads(where: string, params: unknown[]): Promise<HeadRow[]> {
    return this.db.query(
      `SELECT v.*, u.display_name AS requester_name FROM verifications v JOIN users u ON u.id = v.requested_by
        WHERE ${where} ORDER BY v.created_at DESC`,
      params,
    );
  }

  private async cells(id: string): Promise<VerificationCellResult[]> {
    const rows: CellRow[] = await this.db.query(
      `SELECT vc.cell_id, vc.position, vc.kind, vc.recorded_run_id, vc.recorded_digest, vc.run_id,
              nr.status, nr.outputs, nr.output_digest, nr.error, nr.engine_version, nr.language_version,
              rr.outputs AS recorded_outputs
         FROM verification_cells vc
         LEFT JOIN runs nr ON nr.id = vc.run_id
         LEFT JOIN runs rr ON rr.id = vc.recorded_run_id
        WHERE vc.verification_id = $1
        ORDER BY vc.position`,
      [id],
    );
    return rows.map(judgeCell);
  }

  private async versions(id: string): Promise<{ engine: string | null; language: string | null }> {
    const [v] = await this.db.query(
      `SELECT max(r.engine_version) AS engine, max(r.language_version) AS language
         FROM verification_cells vc JOIN runs r ON r.id = vc.run_id WHERE vc.verification_id = $1`,
      [id],
    );
    return { engine: v?.engine ?? null, language: v?.language ?? null };
  }

  private async summarise(h: HeadRow, cells: VerificationCellResult[]): Promise<VerificationSummary> {
    const counts: Record<VerificationCellStatus, number> = { pending: 0, same: 0, differs: 0, failed: 0, skipped: 0 };
    for (const c of cells) counts[c.status] += 1;
    let finishedAt = h.finished_at;
    if (!finishedAt && counts.pending === 0) {
      const [rows] = await this.db.query(
        `UPDATE verifications SET finished_at = now() WHERE id = $1 AND finished_at IS NULL RETURNING finished_at`,
        [h.id],
      );
      finishedAt = rows[0]?.finished_at ?? new Date();
    }
    const done = counts.pending === 0;
    const v = await this.versions(h.id);
    return {
      id: h.id,
      notebookId: h.notebook_id,
      purpose: h.purpose,
      status: done ? 'done' : 'running',
      revisionDigest: h.revision_digest,
      requestedBy: { id: h.requested_by, displayName: h.requester_name },
      createdAt: iso(h.created_at)!,
      finishedAt: done ? iso(finishedAt) : null,
      counts,
      allSame: done && counts.differs === 0 && counts.failed === 0,
      engineVersion: v.engine,
      languageVersion: v.language,
    };
  }

  async get(id: string): Promise<VerificationView> {
    const [h] = await this.heads('v.id = $1', [id]);
    if (!h) throw new NotFoundException('Verification not found');
    const cells = await this.cells(id);
    return { ...(await this.summarise(h, cells)), cells };
  }

  async list(notebookId: string, limit = 20): Promise<VerificationSummary[]> {
    const heads = (await this.heads('v.notebook_id = $1', [notebookId])).slice(0, limit);
    const out: VerificationSummary[] = [];
    for (const h of heads) out.push(await this.summarise(h, await this.cells(h.id)));
    return out;
  }

  async latest(notebookId: string): Promise<VerificationSummary | null> {
    return (await this.list(notebookId, 1))[0] ?? null;
  }
}
