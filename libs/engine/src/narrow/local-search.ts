import { inputError } from '../errors';
import { primesUpTo } from '../primes';
import { checkStop, type WorkHooks } from '../sieve/progress';
import { CONSTRUCT_MAX_K } from './limits';
import { narrowAdmissibility } from './narrow-admissibility';
import { narrowResult } from './narrow-result';
import { SearchRandom } from './random';
import { SieveState } from './sieve-state';
import type { NarrowTuple } from './types';

/** Options of {@link localSearch}. */
export interface LocalSearchOptions {
  /** Move evaluations to spend (default 200 000); the search may end earlier (see `timeUp`). */
  readonly steps?: number;
  /** Seed of the pseudo-random choices (default 1): the same seed and budget give the same result. */
  readonly seed?: number;
  /** Polled every few hundred moves: true ends the search normally, returning the best tuple so far. */
  readonly timeUp?: () => boolean;
  /** Cancellation and progress: `shouldStop` answering true throws EngineError(limit). */
  readonly hooks?: WorkHooks;
  /** Called with every strictly narrower tuple found (the best so far while the search runs). */
  readonly onBest?: (best: NarrowTuple) => void;
  /** Stop as soon as the diameter is at most this (e.g. a known H(k)). */
  readonly target?: number;
  /** Residue classes to try, per odd prime q ≤ k (from another tuple: the merge of two searches). */
  readonly mergeWith?: readonly number[];
  /** Temperature of the acceptance of worse moves (default 0.3; benchmarks tune it). */
  readonly temperature?: number;
  /** Probability of accepting a neutral move (default 0.5). */
  readonly neutral?: number;
  /** Probability of accepting a neutral move that lowers the number of indices covered once (default 0.1). */
  readonly onceWorse?: number;
  /** Share of moves that free an integer covered by two primes by moving both (default 0.05 for k ≤ 5 000, else 0). */
  readonly pairRate?: number;
  /** Restarts change up to this many random classes (default 4). */
  readonly kicks?: number;
  /** Moves without a narrower tuple before a restart from the best state (default max(20 000, 40·π(k))). */
  readonly patience?: number;
}

// Classes of primes up to this are chosen by a full count over the survivors; above, by probing
// classes directly in the window (cheap: the window holds width/q members of a class).
const FULL_COUNT_PRIME = 97;
// Temperature of the acceptance of worsening moves (probability e^(Δ/T) for Δ < 0).
const TEMPERATURE = 0.3;
// Probability of accepting a move that neither gains nor loses survivors (plateau walk).
const NEUTRAL = 0.5;

/**
 * Randomized local improvement of an admissible tuple by moving residue classes, in the manner of
 * the Polymath8 narrow-tuple searches ("adjusting" and the randomized improvement; Polymath,
 * *New equidistribution estimates of Zhang type*, 2014, section on narrow admissible tuples):
 * the tuple is read as the survivors of its span after removing one class per odd prime q ≤ k
 * (the classes it misses) and the integers of the other parity. Then, repeatedly:
 * - an end point is dropped by narrowing the window to the next smaller diameter (the window is
 *   placed where the most survivors remain: the best-interval scan);
 * - one prime's class is moved to another class, which re-inserts the interior points that only
 *   it removed and removes the survivors of the new class; a move that gains survivors is taken,
 *   a neutral one often, a worse one rarely (so the walk can leave a local optimum);
 * - as soon as the window holds k survivors again, they form a narrower admissible tuple;
 * - after a long stretch without success the walk restarts from the best state with a few random
 *   class changes (kicks). With `mergeWith`, the classes of another tuple are offered first, one
 *   prime at a time (merging two tuples).
 * Every reported tuple is re-checked by {@link narrowAdmissibility}. The result is never wider
 * than the start. An upper bound for H(k), not an exact value.
 * @throws EngineError(input) for a non-admissible start or one of more than CONSTRUCT_MAX_K
 *   elements; EngineError(limit) when `hooks.shouldStop` answers true.
 */
export function localSearch(start: readonly number[], options: LocalSearchOptions = {}): NarrowTuple {
  const k = start.length;
  if (k > CONSTRUCT_MAX_K) throw inputError(`localSearch: ${k} elements, at most ${CONSTRUCT_MAX_K}`);
  const check = narrowAdmissibility(start);
  if (!check.admissible) throw inputError(`tuple is not admissible (all classes modulo ${check.prime} covered)`);
  const sorted = [...start].sort((a, b) => a - b);
  if (k < 3) return narrowResult(sorted, 'local-search');
  const what = `searching for a narrower admissible ${k}-tuple`;
  const steps = options.steps ?? 200_000;
  const rng = new SearchRandom(options.seed ?? 1);
  const primes = Int32Array.from(primesUpTo(k)).filter((q) => q > 2);
  const P = primes.length;
  const residues = Int32Array.from(primes, (q) => check.witness[q]);

  let bestTuple = sorted;
  let bestD = sorted[k - 1] - sorted[0];
  let bestResidues: Int32Array = residues;
  const half = bestD / 2;
  const margin = Math.max(16, Math.ceil(half * 0.1));
  const base = sorted[0] - 2 * margin;
  const size = half + 1 + 2 * margin;
  const target = options.target ?? -1;

  const fresh = (res: Int32Array): SieveState => {
    const s = new SieveState(primes, base, size, res);
    s.setWindow(margin + (bestTuple[0] - sorted[0]) / 2, bestD / 2 + 1);
    return s;
  };
  let state = fresh(residues);

  // Narrow the window to the next smaller diameter, where it keeps the most survivors.
  const shrink = (): void => {
    const width = bestD / 2; // diameters up to bestD − 2
    const s = state.surv;
    const n = state.count;
    let best = -1;
    let bestStart = state.lo;
    let ties = 0;
    for (let a = 0, b = 0; a < n; a++) {
      if (s[a] + width > size) break;
      while (b < n && s[b] < s[a] + width) b++;
      const c = b - a;
      if (c > best) {
        best = c;
        bestStart = s[a];
        ties = 1;
      } else if (c === best && rng.below(++ties) === 0) bestStart = s[a];
    }
    state.setWindow(bestStart, width);
  };

  // The window holds ≥ k survivors: keep the narrowest k of them if they beat the best.
  const harvest = (): void => {
    const s = state.surv;
    const n = state.count;
    let start = 0;
    let span = Infinity;
    for (let t = 0; t + k - 1 < n; t++) {
      const d = s[t + k - 1] - s[t];
      if (d < span) {
        span = d;
        start = t;
      }
    }
    if (2 * span < bestD) {
      bestD = 2 * span;
      bestTuple = Array.from(s.subarray(start, start + k), (i) => state.at(i));
      bestResidues = state.residues();
      options.onBest?.(narrowResult(bestTuple, 'local-search'));
    }
    shrink();
  };

  const restart = (kicks: number): void => {
    state = fresh(bestResidues);
    for (let t = 0; t < kicks; t++) {
      const j = rng.below(P);
      state.move(j, rng.below(primes[j]));
    }
    if (state.count >= k) harvest();
    else shrink();
  };

  // Merge: offer the other tuple's class for each prime, keep it unless it loses survivors.
  if (options.mergeWith) {
    const other = options.mergeWith;
    shrink();
    for (let j = 0; j < P; j++) {
      const c = state.offsetOf(j, other[j]);
      if (c === state.offsets[j]) continue;
      if (state.gain(j) - state.loss(j, c) >= 0) state.move(j, c);
      if (state.count >= k) harvest();
    }
  } else {
    shrink();
  }

  // The other class of prime j that holds the fewest survivors of the window, and that number.
  const bestClass = (j: number): [number, number] => {
    const q = primes[j];
    const own = state.offsets[j];
    let c = -1;
    let loss = Infinity;
    if (q <= FULL_COUNT_PRIME) {
      const counts = state.classCounts(j);
      const r0 = rng.below(q);
      for (let t = 0; t < q; t++) {
        const r = r0 + t < q ? r0 + t : r0 + t - q;
        if (r !== own && counts[r] < loss) {
          loss = counts[r];
          c = r;
        }
      }
    } else {
      // Probe classes from a random start, about as much work as one pass over the survivors.
      const probes = Math.min(q - 1, Math.max(2, Math.floor((state.count * q) / state.width)));
      const r0 = rng.below(q);
      for (let t = 0; t < probes && loss > 0; t++) {
        let r = r0 + t;
        if (r >= q) r -= q;
        if (r === own) continue;
        const l = state.loss(j, r);
        if (l < loss) {
          loss = l;
          c = r;
        }
      }
    }
    return [c, loss];
  };

  // Re-insert an interior integer covered by exactly two primes: move both to their best other
  // classes, and undo both unless the survivor count passes the acceptance rule.
  const pairMove = (): void => {
    let i = -1;
    for (let t = 0; t < 8 && i < 0; t++) {
      const x = state.lo + rng.below(state.width);
      if (state.cover[x] === 2) i = x;
    }
    if (i < 0) return;
    let j1 = -1;
    let j2 = -1;
    for (let jj = 0; jj < P; jj++) {
      if ((i - state.offsets[jj]) % primes[jj] !== 0) continue;
      if (j1 < 0) j1 = jj;
      else {
        j2 = jj;
        break;
      }
    }
    if (j2 < 0) return;
    const before = state.count;
    const o1 = state.offsets[j1];
    const o2 = state.offsets[j2];
    const [c1] = bestClass(j1);
    if (c1 >= 0) state.move(j1, c1);
    const [c2] = bestClass(j2);
    if (c2 >= 0) state.move(j2, c2);
    const delta = state.count - before;
    if (delta > 0 || (delta === 0 && rng.next() < neutral) || (delta < 0 && rng.next() < Math.exp(delta / temperature))) {
      if (state.count >= k) harvest();
    } else {
      state.move(j2, o2);
      state.move(j1, o1);
    }
  };

  let sinceBest = 0;
  const patience = options.patience ?? Math.max(20_000, 40 * P);
  const temperature = options.temperature ?? TEMPERATURE;
  const neutral = options.neutral ?? NEUTRAL;
  const onceWorse = options.onceWorse ?? 0.1;
  const kicks = options.kicks ?? 4;
  // The pair move scans all primes for the two covering ones: worth it for small k only (measured at 632).
  const pairRate = options.pairRate ?? (k <= 5000 ? 0.05 : 0);
  for (let step = 0; step < steps && bestD > target; step++) {
    if ((step & 255) === 0) {
      checkStop(options.hooks, what);
      if (options.timeUp?.()) break;
      if (steps < Number.MAX_SAFE_INTEGER) options.hooks?.onProgress?.(step / steps, what);
    }
    const j = rng.below(P + 1);
    if (j === P) {
      // Slide the window by one place (a shifted interval against the same classes).
      const dir = rng.next() < 0.5 ? 1 : -1;
      const delta = state.slideGain(dir);
      if (delta > 0 || (delta === 0 && rng.next() < neutral) || (delta < 0 && rng.next() < Math.exp(delta / temperature))) {
        state.slide(dir);
        if (state.count >= k) harvest();
      }
      continue;
    }
    if (pairRate > 0 && rng.next() < pairRate) {
      pairMove();
      continue;
    }
    const g = state.gain(j);
    const [c, loss] = bestClass(j);
    if (c < 0) continue;
    const delta = g - loss;
    let take = delta > 0;
    if (delta === 0) {
      // Among moves that keep the count, prefer those leaving more indices covered only once.
      const once = state.onceDelta(j, c);
      take = once > 0 || (once === 0 ? rng.next() < neutral : rng.next() < onceWorse);
    } else if (delta < 0) take = rng.next() < Math.exp(delta / temperature);
    if (take) {
      state.move(j, c);
      if (state.count >= k) {
        const before = bestD;
        harvest();
        if (bestD < before) sinceBest = 0;
      }
    }
    if (++sinceBest > patience || state.count < k - 8) {
      sinceBest = 0;
      restart(1 + rng.below(kicks));
    }
  }
  options.hooks?.onProgress?.(1, what);
  return narrowResult(bestTuple, 'local-search');
}
