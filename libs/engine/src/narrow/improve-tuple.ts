import { inputError } from '../errors';
import { CONSTRUCT_MAX_K } from './limits';
import { primesUpTo } from '../primes';
import { narrowAdmissibility } from './narrow-admissibility';
import { narrowResult } from './narrow-result';
import type { NarrowTuple } from './types';

/** Options of {@link improveTuple}. */
export interface ImproveOptions {
  /** Stop after this many successful moves (default 10 000). */
  readonly maxMoves?: number;
}

// A prime is tracked with full class counts while it has at most TIGHT empty classes.
const TIGHT = 24;
// Loose primes have ≥ TIGHT + 1 empty classes at the last census and lose at most one per
// insertion, so they cannot forbid anything (need exactly one empty class) for TIGHT − 1 insertions.
const CENSUS_EVERY = TIGHT - 1;

/**
 * Local improvement of an admissible tuple: repeatedly drop an end point (the one whose removal
 * shrinks the diameter most first) and insert one new integer strictly inside the remaining
 * span that keeps the tuple admissible, as long as such a move exists. Each move lowers the
 * diameter; the size k is unchanged. An insertion x is legal iff x mod q differs from the single
 * empty class of every prime q ≤ k that has exactly one; primes with few empty classes keep full
 * class counts, the others are re-counted every few insertions.
 * @throws EngineError(input) when the tuple is not admissible, has repeated elements or more than
 *   CONSTRUCT_MAX_K elements.
 */
export function improveTuple(tuple: readonly number[], options: ImproveOptions = {}): NarrowTuple {
  if (tuple.length > CONSTRUCT_MAX_K) throw inputError(`improveTuple: ${tuple.length} elements, at most ${CONSTRUCT_MAX_K}`);
  const check = narrowAdmissibility(tuple);
  if (!check.admissible) throw inputError(`tuple is not admissible (all classes modulo ${check.prime} covered)`);
  const k = tuple.length;
  if (k < 3) return narrowResult([...tuple].sort((a, b) => a - b), 'improved');
  const maxMoves = options.maxMoves ?? 10_000;
  const sorted = [...tuple].sort((a, b) => a - b);
  const members = new Set(sorted);
  const primes = Array.from(primesUpTo(k));
  const mod = (x: number, q: number) => ((x % q) + q) % q;

  let tight = new Map<number, Int32Array>();
  const census = () => {
    tight = new Map();
    const xs = Float64Array.from(members).sort();
    for (const q of primes) {
      const counts = new Int32Array(q);
      // Residues walk along the sorted elements (no division while gaps are below q).
      let r = mod(xs[0], q);
      counts[r]++;
      for (let i = 1; i < xs.length; i++) {
        const g = xs[i] - xs[i - 1];
        r += g < q ? g : g % q;
        if (r >= q) r -= q;
        counts[r]++;
      }
      let empty = 0;
      for (let r = 0; r < q; r++) if (counts[r] === 0) empty++;
      if (empty <= TIGHT) tight.set(q, counts);
    }
  };
  census();
  let insertions = 0;

  // Try to replace end point `drop`; returns the inserted value or null (state restored).
  const tryMove = (drop: number, lo: number, hi: number): number | null => {
    members.delete(drop);
    for (const [q, counts] of tight) counts[mod(drop, q)]--;
    const span = hi - lo - 1;
    if (span > 0) {
      const banned = new Uint8Array(span); // index i ↔ lo + 1 + i
      for (const [q, counts] of tight) {
        let zero = -1;
        let zeros = 0;
        for (let r = 0; r < q && zeros < 2; r++) if (counts[r] === 0) { zeros++; zero = r; }
        if (zeros !== 1) continue;
        for (let i = mod(zero - (lo + 1), q); i < span; i += q) banned[i] = 1;
      }
      for (let i = 0; i < span; i++) {
        const x = lo + 1 + i;
        if (banned[i] || members.has(x)) continue;
        members.add(x);
        for (const [q, counts] of tight) counts[mod(x, q)]++;
        return x;
      }
    }
    members.add(drop);
    for (const [q, counts] of tight) counts[mod(drop, q)]++;
    return null;
  };

  let moves = 0;
  while (moves < maxMoves) {
    const min = sortedMin(members);
    const max = sortedMax(members);
    const low2 = secondSmallest(members, min);
    const high2 = secondLargest(members, max);
    // Dropping the minimum leaves span [low2, max]; dropping the maximum leaves [min, high2].
    const plans: Array<[number, number, number]> =
      low2 - min >= max - high2 ? [[min, low2, max], [max, min, high2]] : [[max, min, high2], [min, low2, max]];
    let moved = false;
    for (const [drop, lo, hi] of plans) {
      if (tryMove(drop, lo, hi) !== null) {
        moved = true;
        break;
      }
    }
    if (!moved) break;
    moves++;
    if (++insertions % CENSUS_EVERY === 0) census();
  }
  return narrowResult(Array.from(members).sort((a, b) => a - b), 'improved');
}

function sortedMin(s: Set<number>): number {
  let m = Infinity;
  for (const x of s) if (x < m) m = x;
  return m;
}
function sortedMax(s: Set<number>): number {
  let m = -Infinity;
  for (const x of s) if (x > m) m = x;
  return m;
}
function secondSmallest(s: Set<number>, min: number): number {
  let m = Infinity;
  for (const x of s) if (x > min && x < m) m = x;
  return m;
}
function secondLargest(s: Set<number>, max: number): number {
  let m = -Infinity;
  for (const x of s) if (x < max && x > m) m = x;
  return m;
}
