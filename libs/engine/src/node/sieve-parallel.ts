import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { EngineError, inputError } from '../errors';
import {
  combinePrimeBlockList,
  compilePattern,
  parseSieveRange,
  primeBlockFromJson,
  sievePrimeBlock,
  splitSieveRange,
  type PrimeBlock,
  type RangeEnd,
  type SieveOptions,
} from '../sieve';
import type { SieveTask, SieveTaskReply } from './sieve-messages';
import { kernelFor, sieveKernelBuilt, sieveKernelModule, type SieveKernelChoice } from './wasm-kernel';

/** Options of {@link sievePrimeBlockParallel}. */
export interface ParallelSieveOptions extends SieveOptions {
  /** Worker threads (default: all cores). 1 still uses one worker thread. */
  readonly workers?: number;
  /** Blocks the range is cut into (default: 16 per worker, fewer for short ranges). */
  readonly blocks?: number;
  /** Called after each finished block with the number done and the total. */
  readonly onProgress?: (done: number, total: number) => void;
  /** Stops the workers and rejects with EngineError(limit) "sieve cancelled" when aborted. */
  readonly signal?: AbortSignal;
  /**
   * The WebAssembly kernel (`wasm`), the JavaScript reference sieve (`js`), or the kernel when it
   * is built (`auto`, the default). Ranges ending at or above 2^40 always take the JavaScript sieve.
   */
  readonly kernel?: SieveKernelChoice;
}

/** Ranges shorter than this are sieved in the calling thread (starting workers would cost more). */
const IN_THREAD_BELOW = 20_000_000n;
/** Smallest block handed to a worker. */
const MIN_BLOCK = 10_000_000n;

/**
 * The path of the built worker file: next to this module in dist, or in dist when this module is
 * run from source (tests load the engine from src; `tsc -b` builds dist first).
 */
export function sieveWorkerFile(): string {
  const candidates = [join(__dirname, 'sieve-worker.js'), join(__dirname, '..', '..', 'dist', 'node', 'sieve-worker.js')];
  const found = candidates.find((f) => existsSync(f));
  if (!found) throw new EngineError('limit', `sieve worker not built (looked for ${candidates.join(', ')}); run tsc -b`);
  return found;
}

// Workers are kept between calls (started once per process: about 70 ms each, and their compiled
// code is warm). Idle workers are unref'd, so they never keep the process alive.
const idle: Worker[] = [];

function takeWorkers(n: number): Worker[] {
  const taken = idle.splice(0, n);
  if (taken.length < n) {
    const file = sieveWorkerFile();
    // Compiled once here and posted: a WebAssembly.Module is shared with the workers, not recompiled.
    const workerData = sieveKernelBuilt() ? { kernelModule: sieveKernelModule() } : {};
    while (taken.length < n) taken.push(new Worker(file, { workerData }));
  }
  for (const w of taken) {
    w.removeAllListeners('exit');
    w.ref();
  }
  return taken;
}

function returnWorkers(workers: readonly Worker[]): void {
  for (const w of workers) {
    w.removeAllListeners('message');
    w.removeAllListeners('error');
    w.removeAllListeners('exit');
    w.unref();
    w.once('exit', () => {
      const i = idle.indexOf(w);
      if (i >= 0) idle.splice(i, 1);
    });
    idle.push(w);
  }
}

/** Number of started sieve workers waiting for the next call. */
export function idleSieveWorkers(): number {
  return idle.length;
}

/** Stops the idle sieve workers (they are started again when needed). */
export async function closeSieveWorkers(): Promise<void> {
  await Promise.all(idle.splice(0).map((w) => w.terminate()));
}

/**
 * {@link sievePrimeBlock} with the range cut into blocks that worker threads sieve in parallel; the
 * block summaries are combined exactly (same result as one pass).
 * @throws EngineError as {@link sievePrimeBlock}; EngineError(input) for a bad worker or block count;
 *   EngineError(limit) when `signal` aborts (the workers are stopped).
 */
export async function sievePrimeBlockParallel(
  from: RangeEnd,
  to: RangeEnd,
  options: ParallelSieveOptions = {},
): Promise<PrimeBlock> {
  const range = parseSieveRange(from, to);
  const patterns = (options.patterns ?? []).map((p) => [...compilePattern(p).offsets]);
  const gaps = options.gaps ?? false;
  const workers = options.workers ?? availableParallelism();
  if (!Number.isSafeInteger(workers) || workers < 1 || workers > 256) {
    throw inputError(`worker count ${workers} is not an integer from 1 to 256`);
  }
  const choice = options.kernel ?? 'auto';
  if (choice !== 'auto' && choice !== 'wasm' && choice !== 'js') throw inputError(`sieve kernel "${String(choice)}" is not auto, wasm or js`);
  const length = range.to - range.from + 1n;
  if (length < IN_THREAD_BELOW && options.blocks === undefined) {
    const block = sievePrimeBlock(range.from, range.to, { gaps, patterns, kernel: kernelFor(choice) ?? undefined });
    options.onProgress?.(1, 1);
    return block;
  }
  // Many small blocks: the last ones finish close together on every worker.
  let parts = options.blocks ?? workers * 16;
  if (!Number.isSafeInteger(parts) || parts < 1) throw inputError(`block count ${parts} is not a positive integer`);
  if (options.blocks === undefined && BigInt(parts) * MIN_BLOCK > length) parts = Math.max(1, Number(length / MIN_BLOCK));
  const ranges = splitSieveRange(range.from, range.to, parts);
  const results: PrimeBlock[] = new Array(ranges.length);
  const cancelled = (): EngineError => new EngineError('limit', `sieve of [${range.from}, ${range.to}] cancelled`);
  if (options.signal?.aborted) throw cancelled();
  const pool = takeWorkers(Math.min(workers, ranges.length));
  let failed = false;
  let nextTask = 0;
  let done = 0;
  try {
    await Promise.all(
      pool.map(
        (worker) =>
          new Promise<void>((resolve, reject) => {
            const send = (): void => {
              if (nextTask >= ranges.length) return resolve();
              const id = nextTask++;
              const r = ranges[id]!;
              const task: SieveTask = { id, from: r.from.toString(), to: r.to.toString(), gaps, patterns, kernel: choice };
              worker.postMessage(task);
            };
            worker.on('message', (reply: SieveTaskReply) => {
              if ('error' in reply) return reject(new EngineError(reply.error.kind, reply.error.message));
              results[reply.id] = primeBlockFromJson(reply.block);
              options.onProgress?.(++done, ranges.length);
              send();
            });
            worker.on('error', reject);
            worker.on('exit', (code) => {
              if (code !== 0) reject(new EngineError('limit', `sieve worker stopped with exit code ${code}`));
            });
            options.signal?.addEventListener('abort', () => reject(cancelled()), { once: true });
            send();
          }),
      ),
    );
  } catch (e) {
    failed = true;
    throw e;
  } finally {
    // A worker may still be busy after an error or a cancel: stop those; keep the others.
    if (failed) await Promise.all(pool.map((w) => w.terminate()));
    else returnWorkers(pool);
  }
  return combinePrimeBlockList(results);
}
