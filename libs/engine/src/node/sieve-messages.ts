import type { EngineErrorKind } from '../errors';
import type { PrimeBlockJson } from '../sieve';

/** One block to sieve, sent to a sieve worker. */
export interface SieveTask {
  readonly id: number;
  readonly from: string;
  readonly to: string;
  readonly gaps: boolean;
  readonly patterns: number[][];
  /** Which sieve does the work (see SieveKernelChoice). */
  readonly kernel: 'auto' | 'wasm' | 'js';
}

/** A sieve worker's answer: the block summary, or the engine error it met. */
export type SieveTaskReply =
  | { readonly id: number; readonly block: PrimeBlockJson }
  | { readonly id: number; readonly error: { readonly kind: EngineErrorKind; readonly message: string } };
