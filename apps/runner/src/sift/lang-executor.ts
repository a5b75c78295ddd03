import { evaluate, type RunResult } from '@cribra/lang';
import type { RunError, RunOutput } from '@cribra/contracts';
import { PrefetchDataAccess } from './prefetch-data-access';
import type { SiftExecutor, SiftRequest, SiftResult } from './sift-executor';

/** Passes over one cell at most (each pass may discover more data to fetch). */
const MAX_PASSES = 6;

export function toSiftResult(r: RunResult): SiftResult {
  const error: RunError | null = r.error
    ? { kind: r.error.kind as RunError['kind'], message: r.error.message, ...('line' in r.error && r.error.line ? { line: r.error.line, column: r.error.column } : {}) }
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
 * Executes cells in this thread with @cribra/lang's `evaluate`, within its limits. Data is served
 * through PrefetchDataAccess (evaluate again after fetching what a pass asked for).
 */
export class InThreadExecutor implements SiftExecutor {
  async execute(req: SiftRequest): Promise<SiftResult> {
    const data = new PrefetchDataAccess(req.provider);
    let result: RunResult | null = null;
    for (let pass = 0; pass < MAX_PASSES; pass++) {
      if (req.signal.aborted) break;
      result = evaluate(req.source, {
        data,
        onProgress: (f, note) => req.onProgress(f, note),
        shouldStop: () => req.signal.aborted,
      });
      if (!(await data.fill())) break;
    }
    if (!result || req.signal.aborted) {
      return {
        outputs: result ? (result.outputs as unknown as RunOutput[]) : [],
        digest: null,
        error: { kind: 'cancelled', message: 'the run was cancelled' },
        languageVersion: result?.languageVersion ?? '',
        engineVersion: result?.engineVersion ?? '',
      };
    }
    return toSiftResult(result);
  }

  async close(): Promise<void> {}
}
