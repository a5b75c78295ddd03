import type { EngineErrorKind } from '../errors';
import type { NarrowMethod, SearchPiece } from '../narrow';

/** Work for one narrow-search worker: its pieces, run one after the other until `deadline`; or the baseline narrowTuple(k). */
export type NarrowTask = NarrowPiecesTask | { readonly baseline: number };

export interface NarrowPiecesTask {
  readonly pieces: readonly SearchPiece[];
  /** Wall-clock end (Date.now() milliseconds; worker threads share that clock, not performance.now()). */
  readonly deadline: number;
  /** A tuple to start every piece from when it is narrower than the piece's own seed. */
  readonly start?: readonly number[];
}

/** A worker's reports: a narrower tuple while it runs, its final best, or the error it met. */
export type NarrowTaskReply =
  | { readonly type: 'best'; readonly tuple: readonly number[] }
  | { readonly type: 'done'; readonly tuple: readonly number[]; readonly pieces: number; readonly method?: NarrowMethod }
  | { readonly type: 'error'; readonly kind: EngineErrorKind; readonly message: string };
