import { QUEUES, type CombineJob } from '@cribra/contracts';
import { ENGINE_VERSION } from '@cribra/engine';
import { combineLevelChunks, type ChunkSummaryJson } from '../data/level-tallies';
import type { JobContext, JobHandler } from '../job-context';
import { jobOptions } from '../queue/job-options';

/** Queues the combine step of a computation (one pending combine per computation). */
export async function sendCombine(ctx: JobContext, computationId: string): Promise<void> {
  const job: CombineJob = { computationId };
  await ctx.boss.send(QUEUES.combine, job, { ...jobOptions(ctx.cfg), singletonKey: computationId });
}

/** True when the computation was cancelled (runners then skip its chunks not yet begun). */
export async function isCancelled(ctx: JobContext, computationId: string): Promise<boolean> {
  const { rows } = await ctx.db.query(`SELECT status FROM computations WHERE id = $1`, [computationId]);
  return rows[0]?.status === 'cancelled';
}

/** Ledger ranges need no combine step (blocks are combined on read): recount and close. */
export async function finishLedgerIfComplete(ctx: JobContext, computationId: string): Promise<void> {
  await ctx.db.query(
    `UPDATE computations c SET chunks_done = s.n,
            status = CASE WHEN s.n >= c.chunks_total THEN 'succeeded' ELSE c.status END,
            finished_at = CASE WHEN s.n >= c.chunks_total THEN coalesce(c.finished_at, now()) ELSE NULL END
       FROM (SELECT count(*)::int AS n FROM ledger_blocks b, computations x
              WHERE x.id = $1 AND b.block_index BETWEEN (x.params->>'firstBlock')::int AND (x.params->>'lastBlock')::int) s
      WHERE c.id = $1 AND c.status IN ('queued', 'running')`,
    [computationId],
  );
}

/**
 * Combines the chunks of a wheel level in chunk order with the engine and stores the level.
 * Idempotent: a level already stored by this computation is left as it is.
 */
export const combine: JobHandler<CombineJob> = async (ctx, job) => {
  const { db, cfg } = ctx;
  const { computationId } = job.data;
  const { rows } = await db.query(`SELECT kind, params, status, chunks_total FROM computations WHERE id = $1`, [computationId]);
  if (!rows.length || rows[0].status === 'succeeded' || rows[0].status === 'cancelled') return;
  const c = rows[0] as { kind: string; params: { prime: number }; chunks_total: number };
  if (c.kind === 'ledger') return finishLedgerIfComplete(ctx, computationId);
  const chunks = await db.query(`SELECT summary FROM level_chunks WHERE computation_id = $1 ORDER BY chunk_index`, [computationId]);
  if (chunks.rowCount !== c.chunks_total) return; // a chunk is still missing; its job will send combine again
  const t0 = Date.now();
  const result = combineLevelChunks(c.params.prime, chunks.rows.map((r: { summary: ChunkSummaryJson }) => r.summary));
  const client = await db.connect();
  try {
    await client.query('BEGIN');
    await client.query(
      `UPDATE wheel_levels SET largest_gap = $3, histogram = $4, pattern_tallies = $5, digest = $6, status = 'stored',
              computed_by = $7, computed_at = now(), engine_version = $8
        WHERE prime = $1 AND computation_id = $2`,
      [result.prime, computationId, result.largestGap, JSON.stringify(result.histogram), JSON.stringify(result.patternTallies), result.digest, cfg.runnerId, ENGINE_VERSION],
    );
    await client.query(`UPDATE computations SET status = 'succeeded', finished_at = now(), chunks_done = chunks_total WHERE id = $1`, [computationId]);
    await client.query(`DELETE FROM level_chunks WHERE computation_id = $1`, [computationId]);
    await client.query('COMMIT');
  } catch (err) {
    await client.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    client.release();
  }
  ctx.log(`level ${result.prime}# stored (largest gap ${result.largestGap}, digest ${result.digest.slice(0, 12)}) in ${Date.now() - t0} ms`);
};
