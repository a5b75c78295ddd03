import type { LevelChunkJob } from '@cribra/contracts';
import { computeLevelChunk } from '../data/level-tallies';
import { sleep, type JobHandler } from '../job-context';
import { sendCombine } from './combine.job';

/** Computes one chunk of a wheel level; stored once (primary key), then counted by recount. */
export const levelChunk: JobHandler<LevelChunkJob> = async (ctx, job) => {
  const { computationId, prime, index, chunks, base, quadsOf, radix, split } = job.data;
  const { db, cfg } = ctx;
  const state = await db.query(`SELECT status FROM computations WHERE id = $1`, [computationId]);
  if (!state.rowCount || state.rows[0].status === 'succeeded' || state.rows[0].status === 'failed') return;
  if (state.rows[0].status === 'cancelled') {
    ctx.log(`level ${prime}# chunk ${index + 1}/${chunks} skipped: computation ${computationId} was cancelled`);
    return;
  }
  const exists = await db.query(`SELECT 1 FROM level_chunks WHERE computation_id = $1 AND chunk_index = $2`, [computationId, index]);
  if (!exists.rowCount) {
    if (cfg.testPauseMs) await sleep(cfg.testPauseMs);
    const t0 = Date.now();
    const route = split ? { split: true } : quadsOf === undefined ? {} : { quadsOf, radix };
    const summary = computeLevelChunk(prime, index, { base: base ?? null, chunks, ...route });
    await db.query(
      `INSERT INTO level_chunks (computation_id, chunk_index, summary, runner_id) VALUES ($1, $2, $3, $4)
       ON CONFLICT (computation_id, chunk_index) DO NOTHING`,
      [computationId, index, JSON.stringify(summary), cfg.runnerId],
    );
    const what = split ? ` (split route over ${base}#)` : quadsOf === undefined ? '' : ` (quadruples of ${quadsOf}#)`;
    ctx.log(`level ${prime}# chunk ${index + 1}/${chunks}${what} in ${Date.now() - t0} ms`);
  }
  // Recount rather than increment, so a repeated job never counts twice.
  const { rows } = await db.query(
    `UPDATE computations SET chunks_done = (SELECT count(*) FROM level_chunks WHERE computation_id = $1)
      WHERE id = $1 AND status IN ('queued', 'running') RETURNING chunks_done, chunks_total`,
    [computationId],
  );
  if (rows.length && rows[0].chunks_done >= rows[0].chunks_total) await sendCombine(ctx, computationId);
};
