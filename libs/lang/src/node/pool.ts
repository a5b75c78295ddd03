import { availableParallelism } from 'node:os';
import path from 'node:path';
import { MessageChannel, type MessagePort } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { ENGINE_VERSION } from '@cribra/engine';
import type { RunErrorJson, RunResult } from '../evaluate';
import { outputsDigest } from '../outputs/digest';
import type { DataProvider } from '../provider/types';
import { type Limits, resolveLimits } from '../runtime/limits';
import { LANG_VERSION } from '../version';
import { serveData } from './bridge';
import type { WorkerTask } from './protocol';

export interface SiftPoolOptions {
  /** Worker threads (default: all cores). */
  threads?: number;
  /** Default limits of every run (a run may lower or raise them). */
  limits?: Partial<Limits>;
  /** Milliseconds an idle worker stays alive (default 30 s). */
  idleTimeoutMs?: number;
  /** Workers started at once and kept warm (default 0: started on demand; a cold start loads the parser, about a second). */
  minThreads?: number;
}

export interface PoolRunOptions {
  limits?: Partial<Limits>;
  /** Stored data for the cell (asynchronous; answered on the host thread). */
  data?: DataProvider | null;
  onProgress?: (fraction: number, message: string) => void;
  /** Aborting cancels the run: the worker thread is stopped and the result has error kind 'cancelled'. */
  signal?: AbortSignal;
}

/** Grace after the interpreter's own time limit before the worker is stopped from outside. */
const HARD_STOP_GRACE_MS = 2_000;

/**
 * A pool of worker threads running Sift cells with resource limits (heap size per worker from
 * `maxHeapMb`), a hard wall-clock stop, cancellation and progress reports. `run` never rejects
 * for anything a cell can do: failures come back as a RunResult with `error`.
 */
export class SiftPool {
  private readonly piscina: Piscina;
  private readonly defaults: Partial<Limits>;

  constructor(options: SiftPoolOptions = {}) {
    this.defaults = options.limits ?? {};
    const heap = resolveLimits(this.defaults).maxHeapMb;
    const threads = Math.max(1, options.threads ?? availableParallelism());
    this.piscina = new Piscina({
      filename: workerFile(),
      minThreads: Math.min(threads, Math.max(0, options.minThreads ?? 0)),
      maxThreads: threads,
      idleTimeout: options.idleTimeoutMs ?? 30_000,
      resourceLimits: { maxOldGenerationSizeMb: heap, maxYoungGenerationSizeMb: Math.min(64, Math.max(8, heap / 8)), stackSizeMb: 8 },
    });
  }

  get threads(): number {
    return this.piscina.options.maxThreads;
  }

  async run(source: string, options: PoolRunOptions = {}): Promise<RunResult> {
    const limits = resolveLimits({ ...this.defaults, ...options.limits });
    const started = Date.now();
    const channel = new MessageChannel();
    const flag = new SharedArrayBuffer(4);
    serveData(channel.port1, flag, options.data ?? emptyProvider, options.onProgress);
    const task: WorkerTask = {
      source,
      limits,
      port: channel.port2 as MessagePort,
      flag,
      hasData: Boolean(options.data),
    };
    const stop = new AbortController();
    const timer = setTimeout(() => stop.abort('timeout'), limits.maxMillis + HARD_STOP_GRACE_MS);
    const onAbort = () => stop.abort('cancelled');
    if (options.signal?.aborted) onAbort();
    options.signal?.addEventListener('abort', onAbort);
    try {
      const result = (await this.piscina.run(task, { transferList: [channel.port2 as never], signal: stop.signal })) as RunResult;
      // Worker progress travels on its own port and may trail the result: close with a final report.
      if (result.ok) options.onProgress?.(1, 'done');
      return result;
    } catch (e) {
      return failed(classify(e, stop.signal.reason, limits), Date.now() - started);
    } finally {
      clearTimeout(timer);
      options.signal?.removeEventListener('abort', onAbort);
      channel.port1.close();
    }
  }

  async close(): Promise<void> {
    await this.piscina.destroy();
  }
}

/** The built worker (dist/node/worker.js), also when this module runs from source under a test runner. */
function workerFile(): string {
  return __filename.endsWith('.ts') ? path.resolve(__dirname, '../../dist/node/worker.js') : path.resolve(__dirname, 'worker.js');
}

const emptyProvider: DataProvider = {
  level: async () => null,
  ledger: async () => null,
  upload: async () => null,
};

function classify(e: unknown, reason: unknown, limits: Limits): RunErrorJson {
  if (reason === 'cancelled') return { kind: 'cancelled', message: 'the run was cancelled' };
  if (reason === 'timeout') return { kind: 'limit', message: `the time limit (${limits.maxMillis / 1000} s) was reached` };
  const code = (e as { code?: string })?.code;
  const message = e instanceof Error ? e.message : String(e);
  if (code === 'ERR_WORKER_OUT_OF_MEMORY' || /out of memory|heap/i.test(message)) {
    return { kind: 'limit', message: `the memory limit (${limits.maxHeapMb} MB) was reached` };
  }
  return { kind: 'internal', message: `internal error: ${message}` };
}

function failed(error: RunErrorJson, millis: number): RunResult {
  return {
    ok: false, outputs: [], digest: outputsDigest([]), error, diagnostics: [], steps: 0, millis,
    languageVersion: LANG_VERSION, engineVersion: ENGINE_VERSION,
  };
}
