import { LEDGER_BLOCK_SIZE, QUEUES, type LedgerComputationBody, type PlanJob } from '@cribra/contracts';
import type { JobContext } from '../job-context';
import { jobOptions } from '../queue/job-options';

/** Queues a ledger computation for whole blocks of [from, to) (from a runner, e.g. for a cell). */
export async function requestLedgerComputation(ctx: JobContext, body: LedgerComputationBody): Promise<string> {
  const W = BigInt(LEDGER_BLOCK_SIZE);
  const first = Number(BigInt(body.from) / W);
  const last = Number((BigInt(body.to) - 1n) / W);
  const { rows } = await ctx.db.query(
    `INSERT INTO computations (kind, params, chunks_total) VALUES ('ledger', $1, $2) RETURNING id`,
    [JSON.stringify({ ...body, firstBlock: first, lastBlock: last }), last - first + 1],
  );
  const id: string = rows[0].id;
  const job: PlanJob = { computationId: id };
  await ctx.boss.send(QUEUES.plan, job, { ...jobOptions(ctx.cfg), singletonKey: id });
  return id;
}
