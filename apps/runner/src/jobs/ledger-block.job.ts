import type { LedgerBlockJob } from '@cribra/contracts';
import { computeAndStoreBlock } from '../data/ledger-block';
import { sleep, type JobHandler } from '../job-context';
import { finishLedgerIfComplete, isCancelled } from './combine.job';

/** Computes and stores one ledger block (once, whoever gets there first). */
export const ledgerBlock: JobHandler<LedgerBlockJob> = async (ctx, job) => {
  const { computationId, blockIndex } = job.data;
  // Cancelling is cooperative: a block not begun when its computation was cancelled is skipped.
  if (computationId && (await isCancelled(ctx, computationId))) {
    ctx.log(`ledger block ${blockIndex} skipped: computation ${computationId} was cancelled`);
    return;
  }
  if (ctx.cfg.testPauseMs) await sleep(ctx.cfg.testPauseMs);
  const t0 = Date.now();
  if (await computeAndStoreBlock(ctx.db, blockIndex, ctx.cfg.runnerId)) ctx.log(`ledger block ${blockIndex} in ${Date.now() - t0} ms`);
  if (computationId) await finishLedgerIfComplete(ctx, computationId);
};
