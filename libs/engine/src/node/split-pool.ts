import { availableParallelism } from 'node:os';
import { join, resolve } from 'node:path';
import { Worker } from 'node:worker_threads';
import { EngineError, type EngineErrorKind } from '../errors';
import {
  combineSplitChunks, planSplitChunks, SPLIT_DEFAULT_BASE, splitChunkResultFromJson, splitHistogramsFromResult,
  type SplitChunkResult, type SplitChunkResultJson,
} from '../counts/split-counts';
import { wheelGaps } from '../wheel/level-gaps';
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

function workerFile(): string {
  return __filename.endsWith('.ts') ? resolve(__dirname, '../../dist/node/split-worker.js') : join(__dirname, 'split-worker.js');
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
  const gaps = wheelGaps(base);
  const shared = new SharedArrayBuffer(gaps.length);
  new Uint8Array(shared).set(gaps);
  const workers = Array.from({ length: Math.min(n, specs.length) }, () => new Worker(workerFile(), { workerData: { base, gaps: shared } }));
  const parts: SplitChunkResult[] = [];
  let next = 0;
  let done = 0;
  try {
    await Promise.all(
      workers.map(
        (w) =>
          new Promise<void>((resolveAll, reject) => {
            const send = () => {
              if (next >= specs.length) return resolveAll();
              const id = next++;
              w.postMessage({ id, spec: specs[id] });
            };
            w.on('message', (msg: { id: number; result?: SplitChunkResultJson; error?: { message: string; kind: EngineErrorKind | null } }) => {
              if (msg.error) {
                const s = specs[msg.id]!;
                return reject(new EngineError(msg.error.kind ?? 'limit', `split chunk [${s.from}, ${s.to}) of level ${s.base}: ${msg.error.message}`));
              }
              parts.push(splitChunkResultFromJson(msg.result!));
              options.onProgress?.(++done, specs.length);
              send();
            });
            w.on('error', reject);
            send();
          }),
      ),
    );
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  const result = combineSplitChunks(parts);
  return { histograms: splitHistogramsFromResult(result), result };
}
