import { inputError } from '../errors';
import { checkStop, partHooks, type WorkHooks } from '../sieve/progress';
import { sieveInterval } from './interval-sieve';
import { narrowestWindow } from './narrowest-window';
import { CONSTRUCT_MAX_K } from './limits';
import { localSearch } from './local-search';
import { narrowAdmissibility } from './narrow-admissibility';
import { narrowResult } from './narrow-result';
import { EXACT_MAX_K } from './minimal-diameter';
import { narrowTuple, type NarrowTupleResult } from './narrow-tuple';
import { SearchRandom } from './random';
import type { NarrowTuple } from './types';

/**
 * One independent piece of a narrow-tuple search: a greedy-greedy seed (interval position and
 * sieving bound) and the random seed of the local search that follows. Pieces share nothing, so
 * they can run on different threads or runners; their results are combined by {@link bestOf} and
 * {@link mergeTuples}.
 */
export interface SearchPiece {
  readonly k: number;
  readonly index: number;
  /** Interval start as a fraction of its width: [shift·W, (shift + 1)·W] (−0.5 is centred). */
  readonly shift: number;
  /** Odd primes up to this are sieved at 0 before the greedy phase (greedy-greedy). */
  readonly bound: number;
  /** Seed of the piece's pseudo-random choices. */
  readonly seed: number;
}

/**
 * `count` pieces for k: piece 0 has the shape of the published 34 429-tuple's interval; the others spread the
 * interval position over [−0.75, −0.25] and the bound over [0, 2.4·√k] (below 3: pure greedy) (a low-discrepancy
 * spread, so any prefix of the list covers the ranges evenly).
 */
export function searchPieces(k: number, count: number): SearchPiece[] {
  if (!Number.isSafeInteger(count) || count < 1 || count > 10_000) throw inputError(`piece count must be 1 … 10 000, got ${count}`);
  const root = Math.sqrt(k);
  const pieces: SearchPiece[] = [];
  for (let i = 0; i < count; i++) {
    // Additive recurrences with the golden ratio and √2 (quasi-random points in the square).
    const u = (i * 0.6180339887) % 1;
    const v = (i * 0.4142135623) % 1;
    const b = Math.round(root * 2.4 * v);
    // Piece 0 copies the geometry of the Polymath8 34 429-tuple ([−185662, 202456], bound 137),
    // scaled: the interval starts at −0.478 of its width and the bound is 0.74·√k.
    if (i === 0) pieces.push({ k, index: 0, shift: -185662 / 388118, bound: Math.max(3, Math.round(root * 0.738)), seed: 1 });
    else pieces.push({ k, index: i, shift: -0.75 + 0.5 * u, bound: b < 3 ? 0 : b, seed: 1 + i * 7919 });
  }
  return pieces;
}

/** Options of {@link runSearchPiece} and {@link narrowSearch}. */
export interface SearchOptions {
  /** Move evaluations of the local search (default: until `timeUp`, or 200 000 without it). */
  readonly steps?: number;
  /** Soft end, polled often: true makes the search return its best tuple so far. */
  readonly timeUp?: () => boolean;
  /** Cancellation (throws EngineError(limit)) and progress. */
  readonly hooks?: WorkHooks;
  /** Every strictly narrower tuple found, while the search runs. */
  readonly onBest?: (best: NarrowTuple) => void;
  /** Stop once the diameter is at most this. */
  readonly target?: number;
}

/**
 * Greedy-greedy seed of a piece: sieve [shift·W, shift·W + W] with its bound, W adjusted (at most
 * four sieves, two when `width` — e.g. a known diameter — is given) until at least k survive, and
 * keep the narrowest window of k survivors (the best-interval scan). One sieve per width: the
 * window is cut from that sieve's survivors.
 */
export function pieceSeed(piece: SearchPiece, hooks?: WorkHooks, widthHint?: number): NarrowTuple {
  const { k } = piece;
  let width = widthHint ?? Math.ceil(k * Math.log(k) * 1.12 + k);
  let best: NarrowTuple | null = null;
  const rounds = widthHint ? 2 : 4;
  const sieve = (w: number): number => {
    checkStop(hooks, `sieving a seed interval for k = ${k}`);
    const from = Math.round(piece.shift * w);
    const { survivors } = sieveInterval({ from, to: from + w, fixedBound: piece.bound });
    if (survivors.length >= k) {
      const { start, diameter } = narrowestWindow(survivors, k);
      if (!best || diameter < best.diameter) best = narrowResult(survivors.slice(start, start + k), piece.bound > 2 ? 'greedy-greedy' : 'greedy');
    }
    return survivors.length;
  };
  for (let i = 0; i < rounds + 2 && !(best && i >= rounds); i++) {
    const n = sieve(width);
    // Aim a little above k survivors: the surplus gives the window scan a choice.
    width = Math.max(2 * k, Math.ceil((width * k * 1.01) / Math.max(1, n)) + 4);
  }
  for (let grow = 1.15; !best; grow *= 1.15) sieve(Math.ceil(width * grow));
  // Survivor counts jump with the width, so the secant steps can settle on a poor width; an
  // interval as wide as the best tuple found so far does better (measured at k = 34 429:
  // 388 620 → 388 116). Two such rounds.
  for (let i = 0; i < 2; i++) sieve((best as unknown as NarrowTuple).diameter);
  return best as unknown as NarrowTuple;
}

/**
 * Run one piece: its greedy-greedy seed (or `start`, a tuple to continue from, when it is
 * narrower), then {@link localSearch} with the piece's random seed.
 */
export function runSearchPiece(piece: SearchPiece, options: SearchOptions & { readonly start?: readonly number[] } = {}): NarrowTuple {
  const hint = options.start && options.start.length === piece.k ? spread(options.start) : undefined;
  checkK(piece.k);
  let seed = piece.k <= 2 ? narrowResult(piece.k === 1 ? [0] : [0, 2], 'greedy') : pieceSeed(piece, options.hooks, hint);
  if (options.start && options.start.length === piece.k) {
    const s = narrowResult([...options.start].sort((a, b) => a - b), 'local-search');
    if (s.diameter <= seed.diameter) seed = s;
  }
  options.onBest?.(seed);
  const found = localSearch(seed.tuple, {
    steps: options.steps ?? (options.timeUp ? Number.MAX_SAFE_INTEGER : 200_000),
    seed: piece.seed,
    timeUp: options.timeUp,
    hooks: options.hooks,
    onBest: options.onBest,
    target: options.target,
  });
  return found.diameter < seed.diameter ? found : seed;
}

/** The narrowest of some tuples for the same k (the first on ties). */
export function bestOf(tuples: readonly NarrowTuple[]): NarrowTuple {
  if (tuples.length === 0) throw inputError('bestOf: no tuples');
  let best = tuples[0];
  for (const t of tuples) if (t.diameter < best.diameter) best = t;
  return best;
}

/**
 * Merge two admissible k-tuples: `b` is translated onto the start of `a`, then a local search
 * from `a` is offered b's residue classes one prime at a time before its usual moves.
 * Never wider than `a`.
 */
export function mergeTuples(a: readonly number[], b: readonly number[], options: SearchOptions & { readonly seed?: number } = {}): NarrowTuple {
  if (a.length !== b.length) throw inputError(`mergeTuples: tuples of ${a.length} and ${b.length} elements`);
  const sa = [...a].sort((x, y) => x - y);
  const sb = [...b].sort((x, y) => x - y);
  const moved = sb.map((x) => x - sb[0] + sa[0]);
  const check = narrowAdmissibility(moved);
  if (!check.admissible) throw inputError(`mergeTuples: the second tuple is not admissible (modulo ${check.prime})`);
  const oddPrimes = Object.keys(check.witness).map(Number).filter((q) => q > 2).sort((x, y) => x - y);
  return localSearch(sa, {
    steps: options.steps ?? 20_000,
    seed: options.seed,
    timeUp: options.timeUp,
    hooks: options.hooks,
    onBest: options.onBest,
    target: options.target,
    mergeWith: oddPrimes.map((q) => check.witness[q]),
  });
}

/** Result of {@link narrowSearch}: the narrowest tuple, whether it is exact, and what the search did. */
export type NarrowSearchResult = NarrowTupleResult & {
  /** Diameter of {@link narrowTuple}'s answer, the starting point the search must not lose. */
  readonly baseline: number;
  readonly pieces: number;
};

/**
 * Search for a narrow admissible k-tuple: for k ≤ EXACT_MAX_K the exact H(k) (unless `exhaustive`
 * is false); above, {@link narrowTuple}'s construction, then `pieces` search pieces one after the
 * other (each gets an equal share of the steps or of the time, through `timeUp`), each piece also
 * offered the best tuple so far, and finally a merge of the two narrowest results.
 * The answer is never wider than narrowTuple(k). An upper bound for H(k) unless `exact`.
 * @throws EngineError(input) unless 1 ≤ k ≤ CONSTRUCT_MAX_K; EngineError(limit) when
 *   `hooks.shouldStop` answers true.
 */
export function narrowSearch(
  k: number,
  options: SearchOptions & { readonly pieces?: number; readonly exhaustive?: boolean; readonly now?: () => number; readonly seconds?: number } = {},
): NarrowSearchResult {
  checkK(k);
  const pieces = searchPieces(k, options.pieces ?? 1);
  const useExact = k <= 2 || (options.exhaustive !== false && k <= EXACT_MAX_K);
  const base = useExact ? narrowTuple(k) : k <= EXACT_MAX_K ? { ...pieceSeed(pieces[0]), exact: false } : narrowTuple(k, partHooks(options.hooks, 0, 0.1));
  if (base.exact) return { ...base, baseline: base.diameter, pieces: 0 };
  options.onBest?.(base);
  const now = options.now ?? (() => performance.now());
  const t0 = now();
  const total = options.seconds !== undefined ? options.seconds * 1000 : undefined;
  const results: NarrowTuple[] = [base];
  let best: NarrowTuple = base;
  const report = (t: NarrowTuple): void => {
    if (t.diameter < best.diameter) {
      best = t;
      options.onBest?.(t);
    }
  };
  for (const piece of pieces) {
    const end = total !== undefined ? t0 + (total * (piece.index + 1)) / (pieces.length + 0.25) : undefined;
    const timeUp = end !== undefined ? () => now() >= end || (options.timeUp?.() ?? false) : options.timeUp;
    const steps = options.steps !== undefined ? Math.ceil(options.steps / pieces.length) : undefined;
    const hooks = partHooks(options.hooks, 0.1 + (0.87 * piece.index) / pieces.length, 0.1 + (0.87 * (piece.index + 1)) / pieces.length);
    results.push(runSearchPiece(piece, { steps, timeUp, hooks, onBest: report, target: options.target, start: best.tuple }));
    if (options.timeUp?.() || (options.target !== undefined && best.diameter <= options.target)) break;
  }
  const sorted = [...results].sort((a, b) => a.diameter - b.diameter);
  best = sorted[0];
  const second = sorted.find((t) => t.diameter > best.diameter || t !== best);
  if (second && second !== best) {
    const timeUp = total !== undefined ? () => now() >= t0 + total || (options.timeUp?.() ?? false) : options.timeUp;
    report(mergeTuples(best.tuple, second.tuple, { timeUp, hooks: partHooks(options.hooks, 0.97, 1), target: options.target, steps: options.steps !== undefined ? Math.ceil(options.steps / 10) : undefined }));
  }
  return { ...best, exact: false, baseline: base.diameter, pieces: pieces.length };
}

/**
 * Moves of the local search that take about `seconds` of one core here (measured: about 10^5 moves
 * a second at k = 632, falling roughly like 1/k): a machine-independent budget for callers that
 * need a reproducible result (a cell's digest) rather than a wall-clock one.
 */
export function searchStepsFor(k: number, seconds: number): number {
  return Math.max(1000, Math.round((seconds * 6e7) / (k + 100)));
}

/** Largest minus smallest element. */
function spread(xs: readonly number[]): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of xs) {
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  return hi - lo;
}

function checkK(k: number): void {
  if (!Number.isSafeInteger(k) || k < 1 || k > CONSTRUCT_MAX_K) {
    throw inputError(`k must be an integer from 1 to ${CONSTRUCT_MAX_K}, got ${k}`);
  }
}
