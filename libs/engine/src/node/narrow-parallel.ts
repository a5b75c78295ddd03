import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { EngineError, inputError } from '../errors';
import {
  CONSTRUCT_MAX_K, EXACT_MAX_K, mergeTuples, narrowResult, narrowTuple, searchPieces, type NarrowSearchResult, type NarrowTuple,
} from '../narrow';
import type { NarrowTask, NarrowTaskReply } from './narrow-messages';

/** Options of {@link narrowSearchParallel}. */
export interface ParallelNarrowOptions {
  /** Wall-clock budget of the search in seconds (the baseline construction counts against it). */
  readonly seconds: number;
  /** Worker threads (default: all cores). */
  readonly workers?: number;
  /** Search pieces in all (default: enough for each to get a useful share of the time). */
  readonly pieces?: number;
  /** Every strictly narrower tuple found, from any worker, while the search runs. */
  readonly onBest?: (best: NarrowTuple) => void;
  /** Stops the workers and rejects with EngineError(limit) "narrow search cancelled". */
  readonly signal?: AbortSignal;
}

function workerFile(): string {
  const candidates = [join(__dirname, 'narrow-worker.js'), join(__dirname, '..', '..', 'dist', 'node', 'narrow-worker.js')];
  const found = candidates.find((f) => existsSync(f));
  if (!found) throw new EngineError('limit', `narrow worker not built (looked for ${candidates.join(', ')}); run tsc -b`);
  return found;
}

/** Seconds one piece should get at least: seeding and a useful local search grow with k. */
function pieceSeconds(k: number): number {
  return Math.max(2, k / 500);
}

/**
 * {@link narrowSearch} on worker threads: for k ≤ 100 the exact narrowTuple(k) at once; above,
 * narrowTuple(k) on a thread of its own (the answer waits for it) and the pieces of {@link searchPieces} dealt round-robin to the workers, each worker
 * running its pieces one after the other; at the end the two narrowest results are merged
 * ({@link mergeTuples}) in the calling thread during the last 5 % of the time. Never wider than
 * narrowTuple(k); an upper bound for H(k) unless `exact`.
 * @throws EngineError(input) for a bad k, seconds or worker count; EngineError(limit) when cancelled.
 */
export async function narrowSearchParallel(k: number, options: ParallelNarrowOptions): Promise<NarrowSearchResult> {
  if (!Number.isSafeInteger(k) || k < 1 || k > CONSTRUCT_MAX_K) throw inputError(`k must be an integer from 1 to ${CONSTRUCT_MAX_K}, got ${k}`);
  const { seconds } = options;
  if (!(seconds > 0) || seconds > 86_400) throw inputError(`search time must be more than 0 and at most 86 400 seconds, got ${seconds}`);
  const workers = options.workers ?? availableParallelism();
  if (!Number.isSafeInteger(workers) || workers < 1 || workers > 256) throw inputError(`worker count ${workers}: must be 1 … 256`);
  const t0 = Date.now();
  if (k <= EXACT_MAX_K) {
    const exact = narrowTuple(k);
    return { ...exact, baseline: exact.diameter, pieces: 0 };
  }
  let best: NarrowTuple | null = null;
  let baseline: NarrowTuple | null = null;
  const offer = (t: NarrowTuple) => {
    if (!best || t.diameter < best.diameter) {
      best = t;
      options.onBest?.(t);
    }
  };
  const deadline = t0 + seconds * 950;
  const count = options.pieces ?? Math.max(workers, Math.min(workers * 8, Math.floor((seconds * workers) / pieceSeconds(k))));
  const pieces = searchPieces(k, count);
  const threads: Worker[] = [];
  const finals: NarrowTuple[] = [];
  try {
    const file = workerFile();
    await new Promise<void>((resolve, reject) => {
      let running = 0;
      const abort = () => reject(new EngineError('limit', 'narrow search cancelled'));
      if (options.signal?.aborted) return abort();
      options.signal?.addEventListener('abort', abort, { once: true });
      const start = (task: NarrowTask, isBaseline: boolean) => {
        const worker = new Worker(file);
        threads.push(worker);
        running++;
        worker.on('message', (m: NarrowTaskReply) => {
          if (m.type === 'error') return reject(new EngineError(m.kind, m.message));
          const t = narrowResult([...m.tuple], isBaseline ? 'greedy-greedy' : 'local-search');
          if (isBaseline) baseline = { ...t, method: m.type === 'done' && m.method ? m.method : t.method };
          else offer(t);
          if (m.type === 'done') {
            if (!isBaseline) finals.push(t);
            if (--running === 0) resolve();
          }
        });
        worker.on('error', reject);
        worker.postMessage(task);
      };
      // narrowTuple(k), the baseline the answer must not lose, on a thread of its own (seconds of
      // work at large k) while the pieces search from their own seeds.
      start({ baseline: k }, true);
      for (let w = 0; w < workers; w++) {
        const mine = pieces.filter((p) => p.index % workers === w);
        if (mine.length) start({ pieces: mine, deadline }, false);
      }
    });
  } finally {
    await Promise.all(threads.map((t) => t.terminate()));
  }
  const base = baseline as NarrowTuple | null;
  if (!base) throw new EngineError('limit', 'narrow search: the baseline construction did not finish');
  offer(base);
  const ranked = [...finals].sort((a, b) => a.diameter - b.diameter);
  if (ranked.length >= 2 && ranked[1].tuple !== ranked[0].tuple) {
    const end = t0 + seconds * 1000;
    offer(mergeTuples((best as unknown as NarrowTuple).tuple, ranked[1].tuple, { timeUp: () => Date.now() >= end, steps: Number.MAX_SAFE_INTEGER, seed: 17 }));
  }
  const answer = best as unknown as NarrowTuple;
  return { ...answer, exact: false, baseline: base.diameter, pieces: pieces.length };
}
