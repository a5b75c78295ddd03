import { QUEUES, type RunCellJob, type LedgerComputationBody, type RunError } from '@cribra/contracts';
import { PgDataProvider } from '../data/pg-data-provider';
import { requestLedgerComputation } from '../data/ledger-requests';
import { sleep, type JobContext, type JobHandler } from '../job-context';
import type { SiftResult } from '../sift/sift-executor';

/** Least time between two progress writes of one run. */
const PROGRESS_EVERY_MS = 250;
/** How often a running cell checks whether it was cancelled or taken over. */
const CANCEL_POLL_MS = 1000;

/**
 * Executes one run. Claims the row (queued or running → running by this runner, attempts + 1),
 * executes in the Sift pool, and stores the result only while it still owns the row: a run that
 * was cancelled, or re-taken by another runner after this one was presumed dead, is left alone.
 * So a run completes exactly once whatever happens to runners.
 */
export const runCell: JobHandler<RunCellJob> = async (ctx, job) => {
  const { db, cfg } = ctx;
  const { runId } = job.data;
  const claimed = await db.query(
    `UPDATE runs SET status = 'running', runner_id = $2, attempts = attempts + 1, started_at = now(),
            progress = 0, progress_note = NULL, error = NULL
      WHERE id = $1 AND status IN ('queued', 'running')
      RETURNING notebook_id, cell_kind, source`,
    [runId, cfg.runnerId],
  );
  if (!claimed.rowCount) return; // cancelled or already finished: nothing to do
  const { notebook_id: notebookId, cell_kind: kind, source } = claimed.rows[0];
  if (cfg.testPauseMs) await sleep(cfg.testPauseMs);

  const started = Date.now();
  const abort = new AbortController();
  const watch = setInterval(() => {
    void db
      .query(`SELECT status, runner_id FROM runs WHERE id = $1`, [runId])
      .then(({ rows }) => {
        if (!rows.length || rows[0].status !== 'running' || rows[0].runner_id !== cfg.runnerId) abort.abort();
      })
      .catch(() => undefined);
  }, CANCEL_POLL_MS);

  let lastWrite = 0;
  let pending: { fraction: number; note: string } | null = null;
  const writeProgress = (): void => {
    if (!pending) return;
    const { fraction, note } = pending;
    pending = null;
    lastWrite = Date.now();
    void db
      .query(`UPDATE runs SET progress = $2, progress_note = $3 WHERE id = $1 AND status = 'running' AND runner_id = $4`, [
        runId,
        Math.max(0, Math.min(1, fraction)),
        note.slice(0, 200),
        cfg.runnerId,
      ])
      .catch(() => undefined);
  };
  const onProgress = (fraction: number, note: string): void => {
    pending = { fraction, note };
    if (Date.now() - lastWrite >= PROGRESS_EVERY_MS) writeProgress();
  };

  const provider = new PgDataProvider(db, {
    notebookId,
    runnerId: cfg.runnerId,
    maxInlineBlocks: 20,
    requestLedger: async (from, to) => {
      const body: LedgerComputationBody = { from: from.toString(), to: to.toString() };
      await requestLedgerComputation(ctx, body);
    },
    onNote: (note) => onProgress(0, note),
  });

  let result: SiftResult;
  try {
    result = await ctx.executor.execute({ source, kind, provider, signal: abort.signal, onProgress });
  } finally {
    clearInterval(watch);
  }
  result = withinOutputLimit(result, cfg.runOutputMaxBytes);
  const failed = result.error !== null;
  const done = await storeResult(db, runId, cfg.runnerId, failed, result, Date.now() - started);
  if (done === 1) {
    ctx.log(`run ${runId} ${failed ? 'failed' : 'succeeded'} in ${Date.now() - started} ms (attempt job ${job.id})`);
  }
};

/**
 * Checked before storing: outputs above the per-run byte limit (their JSON as stored) are not
 * stored; the run fails with a limit error naming both sizes. One run of 33.7 MB used to make
 * every read of its notebook 33.7 MB.
 */
export function withinOutputLimit(result: SiftResult, maxBytes: number): SiftResult {
  const size = Buffer.byteLength(JSON.stringify(result.outputs), 'utf8');
  if (size <= maxBytes) return result;
  const error: RunError = {
    kind: 'limit',
    message: `the outputs of this run take ${size} bytes, above the limit of ${maxBytes} bytes per run; show fewer or smaller values (a table of summaries, a count, a digest)`,
    limit: { name: 'run_output_bytes', maxBytes, sizeBytes: size },
  };
  return { ...result, outputs: [], digest: null, error };
}

/**
 * SQLSTATE classes of a result the database will never accept however often it is retried
 * (22: data exception, e.g. a string jsonb refuses; 54: program limit exceeded, e.g. a value too
 * large for a row).
 */
const UNSTORABLE = /^(22|54)/;

/**
 * Stores the result while this runner still owns the run; returns the rows written (0 or 1).
 * A result the database refuses for good ends the run `failed` with the reason instead, so the
 * run is never left `running`; connection errors are thrown (the job is retried).
 */
async function storeResult(db: JobContext['db'], runId: string, runnerId: string, failed: boolean, result: SiftResult, durationMs: number): Promise<number> {
  try {
    return await writeResult(db, runId, runnerId, failed, result, durationMs);
  } catch (err) {
    const code = (err as { code?: string }).code ?? '';
    if (!UNSTORABLE.test(code)) throw err;
    const message = `the result could not be stored: ${(err as Error).message} (SQLSTATE ${code})`;
    const closed = await db.query(
      `UPDATE runs SET status = 'failed', error = $3, progress_note = NULL, finished_at = now(), duration_ms = $4
        WHERE id = $1 AND status = 'running' AND runner_id = $2`,
      [runId, runnerId, JSON.stringify({ kind: 'internal', message }), durationMs],
    );
    return closed.rowCount ?? 0;
  }
}

async function writeResult(db: JobContext['db'], runId: string, runnerId: string, failed: boolean, result: SiftResult, durationMs: number): Promise<number> {
  const done = await db.query(
    `UPDATE runs SET status = $3::varchar, outputs = $4, output_digest = $5, error = $6, engine_version = $7,
            language_version = $8, progress = CASE WHEN $3::varchar = 'succeeded' THEN 1 ELSE progress END,
            progress_note = NULL, finished_at = now(), duration_ms = $9
      WHERE id = $1 AND status = 'running' AND runner_id = $2`,
    [
      runId,
      runnerId,
      failed ? 'failed' : 'succeeded',
      JSON.stringify(result.outputs),
      result.digest,
      result.error ? JSON.stringify(result.error) : null,
      result.engineVersion,
      result.languageVersion,
      durationMs,
    ],
  );
  return done.rowCount ?? 0;
}

export const RUN_CELL_QUEUE = QUEUES.runCell;
