import { availableParallelism } from 'node:os';
import { nodeWorkerFile, runChunksOnWorkers } from './chunk-workers';
import {
  combineSplitChunks, planSplitChunks, SPLIT_DEFAULT_BASE, splitChunkResultFromJson, splitHistogramsFromResult,
  type SplitChunkResult, type SplitChunkResultJson, type SplitChunkSpec,
} from '../counts/split-counts';
import type { GapHistogram } from '../wheel/tally';

/** Options of {@link splitHistogramsParallel}. */
export interface SplitPoolOptions {
  /** worker threads (default: all cores) */
  readonly workers?: number;
  /** base level (default 23) */
  readonly base?: number;
  /** chunks per worker (default 8) */
  readonly chunksPerWorker?: number;
  /** called after each finished chunk */
  readonly onProgress?: (done: number, total: number) => void;
}

/**
 * Gap histograms of the levels `levels` (primes above the base, ≤ 47) by the split route with the
 * base members shared out between worker threads (the base cycle in shared memory); the combined
 * histograms are checked by Σ n_g = φ(p#) and Σ g·n_g = p#. Also returns the combined chunk result
 * (its window statistics). Any worker error rejects with an EngineError naming the chunk.
 */
export async function splitHistogramsParallel(
  levels: readonly number[], options: SplitPoolOptions = {},
): Promise<{ histograms: Map<number, GapHistogram>; result: SplitChunkResult }> {
  const base = options.base ?? SPLIT_DEFAULT_BASE;
  const n = Math.max(1, options.workers ?? availableParallelism());
  const specs = planSplitChunks(base, levels, n * (options.chunksPerWorker ?? 8));
  const parts = (
    await runChunksOnWorkers<SplitChunkSpec, SplitChunkResultJson>({
      file: nodeWorkerFile('split-worker.js'), base, specs, workers: n, key: 'result',
      describe: (s) => `split chunk [${s.from}, ${s.to}) of level ${s.base}`, onProgress: options.onProgress,
    })
  ).map(splitChunkResultFromJson);
  const result = combineSplitChunks(parts);
  return { histograms: splitHistogramsFromResult(result), result };
}
