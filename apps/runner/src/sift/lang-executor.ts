import type { RunResult } from '@cribra/lang';
import { SiftPool } from '@cribra/lang/node';
import type { RunError, RunOutput } from '@cribra/contracts';
import type { SiftExecutor, SiftRequest, SiftResult } from './sift-executor';

/** A Sift run result as the runner stores it (digest only for a successful run). */
export function toSiftResult(r: RunResult): SiftResult {
  const e = r.error;
  const error: RunError | null = e
    ? { kind: e.kind as RunError['kind'], message: e.message, ...('line' in e && e.line ? { line: e.line, column: e.column } : {}) }
    : null;
  return {
    outputs: r.outputs as unknown as RunOutput[],
    digest: r.ok ? r.digest : null,
    error,
    languageVersion: r.languageVersion,
    engineVersion: r.engineVersion,
  };
}

/**
 * Executes cells in @cribra/lang's worker pool: one worker thread per runner slot, with the
 * language's limits (steps, time, heap), cancellation through the abort signal, and the cell's
 * data served from PostgreSQL through the pool's synchronous bridge.
 */
export class PoolExecutor implements SiftExecutor {
  private readonly pool: SiftPool;

  constructor(threads: number) {
    this.pool = new SiftPool({ threads });
  }

  async execute(req: SiftRequest): Promise<SiftResult> {
    const result = await this.pool.run(req.source, { data: req.provider, onProgress: req.onProgress, signal: req.signal });
    return toSiftResult(result);
  }

  async close(): Promise<void> {
    await this.pool.close();
  }
}
