import type { RunError, RunOutput } from '@cribra/contracts';
import type { DataProvider } from '@cribra/lang';

/** One cell to execute. */
export interface SiftRequest {
  source: string;
  kind: 'query' | 'claim';
  /** Stored data the cell may read (levels, ledger, uploads of its notebook). */
  provider: DataProvider;
  signal: AbortSignal;
  onProgress: (fraction: number, note: string) => void;
}

/** What a finished execution gives back; `error` set means the cell failed (outputs so far kept). */
export interface SiftResult {
  outputs: RunOutput[];
  /** Canonical digest of the outputs (only for a successful run). */
  digest: string | null;
  error: RunError | null;
  languageVersion: string;
  engineVersion: string;
}

/**
 * The runner's view of Sift. The implementation (sift/lang-executor.ts) adapts @cribra/lang's
 * worker pool; tests of the queue can swap in another executor.
 */
export interface SiftExecutor {
  execute(request: SiftRequest): Promise<SiftResult>;
  close(): Promise<void>;
}
