import { QUEUES, type LedgerBlockJob, type LevelChunkJob, type PlanJob } from '@cribra/contracts';
import { planLevel as planLevelChunks } from '../data/level-tallies';
import type { JobContext, JobHandler } from '../job-context';
import { jobOptions } from '../queue/job-options';
import { finishLedgerIfComplete, sendCombine } from './combine.job';

const INSERT_BATCH = 1000;

/**
 * Splits a computation into chunk jobs any runner may take. Safe to repeat (a retried plan job
 * only re-sends chunks that are not stored yet; chunk handlers skip stored work).
 */
export const plan: JobHandler<PlanJob> = async (ctx, job) => {
  const { db } = ctx;
  const { rows } = await db.query(`SELECT id, kind, params, status FROM computations WHERE id = $1`, [job.data.computationId]);
  if (!rows.length) return;
  const c = rows[0] as { id: string; kind: 'level' | 'ledger'; params: Record<string, number | string>; status: string };
  if (c.status === 'succeeded' || c.status === 'failed' || c.status === 'cancelled') return;
  if (c.kind === 'level') await planLevel(ctx, c.id, Number(c.params.prime));
  else await planLedger(ctx, c.id, Number(c.params.firstBlock), Number(c.params.lastBlock));
};

async function sendAll(ctx: JobContext, name: string, datas: object[]): Promise<void> {
  const opts = jobOptions(ctx.cfg);
  for (let i = 0; i < datas.length; i += INSERT_BATCH) {
    await ctx.boss.insert(datas.slice(i, i + INSERT_BATCH).map((data) => ({ name, data, ...opts })));
  }
}

async function planLevel(ctx: JobContext, id: string, prime: number): Promise<void> {
  const { cfg } = ctx;
  const { base, chunks, quadsOf, radix, split } = planLevelChunks(
    prime, cfg.levelOnePieceUpTo, cfg.levelStepsPerChunk, cfg.levelRecursionFrom, cfg.levelSplitFrom, cfg.levelSplitChunks,
  );
  const route = split ? { split: true } : quadsOf === undefined ? {} : { quadsOf, radix };
  await ctx.db.query(
    `UPDATE computations SET chunks_total = $2, status = 'running', started_at = coalesce(started_at, now()) WHERE id = $1 AND status IN ('queued', 'running')`,
    [id, chunks],
  );
  await ctx.db.query(`UPDATE wheel_levels SET status = 'computing' WHERE prime = $1 AND computation_id = $2 AND status = 'pending'`, [prime, id]);
  const { rows } = await ctx.db.query(`SELECT chunk_index FROM level_chunks WHERE computation_id = $1`, [id]);
  const done = new Set(rows.map((r: { chunk_index: number }) => r.chunk_index));
  const jobs: LevelChunkJob[] = [];
  for (let index = 0; index < chunks; index++) if (!done.has(index)) jobs.push({ computationId: id, prime, index, chunks, base, ...route });
  if (jobs.length) await sendAll(ctx, QUEUES.levelChunk, jobs);
  else await sendCombine(ctx, id);
  const how = split
    ? `by the split route over the members of ${base}#`
    : quadsOf === undefined ? (base === null ? 'in one piece' : `streamed over ${base}#`) : `by recursion from the quadruples of ${quadsOf}# over ${base}#`;
  ctx.log(`level ${prime}#: ${chunks} chunk(s) planned, ${how}`);
}

async function planLedger(ctx: JobContext, id: string, first: number, last: number): Promise<void> {
  await ctx.db.query(
    `UPDATE computations SET chunks_total = $2, status = 'running', started_at = coalesce(started_at, now()) WHERE id = $1 AND status IN ('queued', 'running')`,
    [id, last - first + 1],
  );
  const { rows } = await ctx.db.query(`SELECT block_index FROM ledger_blocks WHERE block_index BETWEEN $1 AND $2`, [first, last]);
  const have = new Set(rows.map((r: { block_index: number }) => r.block_index));
  const jobs: LedgerBlockJob[] = [];
  for (let i = first; i <= last; i++) if (!have.has(i)) jobs.push({ computationId: id, blockIndex: i });
  if (jobs.length) await sendAll(ctx, QUEUES.ledgerBlock, jobs);
  await finishLedgerIfComplete(ctx, id);
  ctx.log(`ledger blocks ${first}..${last}: ${jobs.length} to compute`);
}
