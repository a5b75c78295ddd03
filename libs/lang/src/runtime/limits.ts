/** Bounds on one run of a cell. Every run ends — in its outputs or in a typed limit error. */
export interface Limits {
  /** Evaluation steps (one per expression node and per loop iteration). */
  maxSteps: number;
  /** Wall-clock milliseconds, checked every few thousand steps and inside long builtins. */
  maxMillis: number;
  /** Largest integer size, in bits, that arithmetic may produce. */
  maxBits: number;
  /** Largest series, tuple or table (rows) a run may build. */
  maxElements: number;
  /** Nesting of user function calls. */
  maxCallDepth: number;
  /** Outputs per run. */
  maxOutputs: number;
  /** Heap of a worker thread, in MB (enforced by the worker pool, not by the interpreter). */
  maxHeapMb: number;
}

export const DEFAULT_LIMITS: Readonly<Limits> = Object.freeze({
  maxSteps: 20_000_000,
  maxMillis: 60_000,
  maxBits: 262_144,
  maxElements: 1_000_000,
  maxCallDepth: 100,
  maxOutputs: 200,
  maxHeapMb: 512,
});

/** Defaults overridden by the given fields; refuses non-positive or non-finite bounds. */
export function resolveLimits(partial?: Partial<Limits>): Limits {
  const out: Limits = { ...DEFAULT_LIMITS };
  for (const [k, v] of Object.entries(partial ?? {})) {
    if (v === undefined) continue;
    if (typeof v !== 'number' || !(v > 0) || !Number.isFinite(v)) throw new RangeError(`limit ${k} must be a positive number`);
    (out as unknown as Record<string, number>)[k] = v;
  }
  return out;
}
