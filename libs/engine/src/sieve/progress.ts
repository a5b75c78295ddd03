// Progress reports and a stop check for long synchronous engine calls (sieve, Hardy–Littlewood, wheel streaming).
import { limitError } from '../errors';

/**
 * Optional hooks of a long synchronous engine call. Both are called at a coarse grain (per group of
 * sieve segments or per streamed chunk, tens of milliseconds of work apart), so they cost nothing
 * measurable.
 */
export interface WorkHooks {
  /**
   * Fraction of the work done (0 … 1, non-decreasing; the last call reports 1) and what is being
   * computed.
   */
  readonly onProgress?: (fraction: number, message?: string) => void;
  /**
   * Polled at the same points; answering true stops the work with EngineError(limit)
   * "stopped on request while …". It may also throw its own error (a time limit, a cancellation of
   * the caller), which then propagates unchanged. A stopped call leaves no partial result behind.
   */
  readonly shouldStop?: () => boolean;
}

/**
 * Polls `hooks.shouldStop`.
 * @throws EngineError(limit) "stopped on request while <what>" when it answers true.
 */
export function checkStop(hooks: WorkHooks | undefined, what: string): void {
  if (hooks?.shouldStop?.()) throw limitError(`stopped on request while ${what}`);
}

/**
 * Hooks for a part of a larger task: the part's fractions 0 … 1 are mapped onto [lo, hi] of the
 * whole, and its message replaced by `message` when one is given. Without an onProgress the hooks
 * are passed through.
 */
export function partHooks(hooks: WorkHooks | undefined, lo: number, hi: number, message?: string): WorkHooks {
  const report = hooks?.onProgress;
  if (!hooks || !report) return hooks ?? {};
  return {
    shouldStop: hooks.shouldStop,
    onProgress: (f, m) => report(lo + (hi - lo) * Math.min(1, Math.max(0, f)), message ?? m),
  };
}
