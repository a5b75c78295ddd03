import { inputError, limitError } from '../errors';
import { primesUpTo } from '../primes';

/** How to pick the class to remove, among the least occupied classes modulo a prime. */
export type TieBreak = 'smallest' | 'largest';

/** Options of {@link sieveInterval}. */
export interface IntervalSieveOptions {
  /** Interval [from, to] of integers to sieve (safe integers, from ≤ to). */
  readonly from: number;
  readonly to: number;
  /**
   * Fixed phase: remove 1 mod 2 and 0 mod q for every odd prime q ≤ fixedBound (a Schinzel-type
   * start; 0 or 1 means no odd prime is fixed). Default 0.
   */
  readonly fixedBound?: number;
  /** Greedy phase tie-break among least occupied classes (default 'smallest' residue in [0, q)). */
  readonly tieBreak?: TieBreak;
  /** Stop the greedy phase after this prime (default: run until the survivors are admissible). */
  readonly greedyUpTo?: number;
}

/** Survivors of {@link sieveInterval} and the class removed for each prime (absent: none removed). */
export interface IntervalSieveResult {
  readonly survivors: number[];
  readonly removed: Record<number, number>;
  readonly lastPrime: number;
}

/** Most survivors the greedy phase accepts (its work is about survivors × π(survivors)). */
export const GREEDY_MAX_SURVIVORS = 150_000;

/** Largest interval length accepted by {@link sieveInterval}. */
export const SIEVE_MAX_LENGTH = 200_000_000;

/**
 * Sieve an interval of integers by one residue class per prime, in increasing order of primes:
 * 1 mod 2; then 0 mod q for odd q ≤ fixedBound; then, for each further prime q, the least occupied
 * class among the current survivors ("greedy"; nothing is removed when a class is already empty).
 * The greedy phase stops at the first prime larger than the number of survivors, where the
 * survivors are admissible (a set of m integers cannot cover all classes of a prime q > m).
 * With fixedBound > 0 this is the "greedy-greedy" sieve of the Polymath8 narrow-tuple records.
 * Residues are taken in [0, q) for negative integers too (−1 ≡ q − 1).
 * @throws EngineError(input) for a bad interval, EngineError(limit) above SIEVE_MAX_LENGTH or when the
 *   greedy phase would start with more than GREEDY_MAX_SURVIVORS survivors.
 */
export function sieveInterval(options: IntervalSieveOptions): IntervalSieveResult {
  const { from, to } = options;
  if (!Number.isSafeInteger(from) || !Number.isSafeInteger(to) || from > to) {
    throw inputError(`bad sieve interval [${from}, ${to}]`);
  }
  const length = to - from + 1;
  if (length > SIEVE_MAX_LENGTH) throw limitError(`sieve interval of ${length} integers: at most ${SIEVE_MAX_LENGTH}`);
  const fixedBound = options.fixedBound ?? 0;
  const tieBreak = options.tieBreak ?? 'smallest';
  const greedyUpTo = options.greedyUpTo ?? Infinity;
  const mod = (x: number, q: number) => ((x % q) + q) % q;

  // Fixed phase on a byte map of the interval.
  const alive = new Uint8Array(length).fill(1);
  const removed: Record<number, number> = {};
  const strike = (q: number, r: number) => {
    removed[q] = r;
    for (let i = mod(r - from, q); i < length; i += q) alive[i] = 0;
  };
  strike(2, 1);
  const primeBound = Math.max(3, Math.min(length, 1 << 30));
  const fixedPrimes = primesUpTo(Math.min(fixedBound, primeBound));
  for (const q of fixedPrimes) if (q > 2) strike(q, 0);
  // Survivors as offsets i = x − from (non-negative), so residues are (i + shift) mod q.
  let count = 0;
  for (let i = 0; i < length; i++) count += alive[i];
  let live = new Int32Array(count);
  for (let i = 0, j = 0; i < length; i++) if (alive[i]) live[j++] = i;

  // Greedy phase over the survivors list.
  let lastPrime = fixedPrimes.length ? fixedPrimes[fixedPrimes.length - 1] : 2;
  if (count > GREEDY_MAX_SURVIVORS && greedyUpTo > lastPrime) {
    throw limitError(
      `greedy sieving of ${count} survivors (one pass per prime up to that count) is above the limit of ${GREEDY_MAX_SURVIVORS}; use a shorter interval or a larger fixed bound`,
    );
  }
  const greedyPrimes = primesUpTo(Math.max(3, Math.min(count, length)));
  let occ = new Int32Array(0);
  for (const q of greedyPrimes) {
    if (q <= lastPrime) continue;
    if (q > count || q > greedyUpTo) break;
    lastPrime = q;
    if (occ.length < q) occ = new Int32Array(q);
    occ.fill(0, 0, q);
    const shift = mod(from, q);
    // Residues walk along the sorted offsets: r ← r + gap (mod q), division only for big gaps.
    let r = (live[0] + shift) % q;
    let prev = live[0];
    for (let j = 0; j < count; j++) {
      const g = live[j] - prev;
      prev = live[j];
      r += g < q ? g : g % q;
      if (r >= q) r -= q;
      occ[r]++;
    }
    let best = 0;
    for (let r = 1; r < q; r++) {
      if (occ[r] < occ[best] || (tieBreak === 'largest' && occ[r] === occ[best])) best = r;
    }
    if (occ[best] === 0) continue;
    removed[q] = best;
    let m = 0;
    r = (live[0] + shift) % q;
    prev = live[0];
    for (let j = 0; j < count; j++) {
      const x = live[j];
      const g = x - prev;
      prev = x;
      r += g < q ? g : g % q;
      if (r >= q) r -= q;
      if (r !== best) live[m++] = x;
    }
    count = m;
  }
  live = live.subarray(0, count);
  const survivors = Array.from(live, (i) => from + i);
  return { survivors, removed, lastPrime };
}
