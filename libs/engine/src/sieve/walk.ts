import { inputError, limitError } from '../errors';
import { SIEVE_MAX_TO, sievingPrimesFor } from './sieving-primes';

/** Odd numbers per segment of the walk (one byte each: 2^16 bytes, 131 072 integers). */
const SEGMENT_ODDS = 1 << 16;

/**
 * Visits the primes p with lo ≤ p ≤ hi in increasing order, one at a time, and stops early when
 * `visit` returns false (whatever `visit` throws goes through). For callers that need the primes
 * themselves — the sieve's summaries are faster for counts. Segmented sieve of Eratosthenes over
 * the odd numbers (segments of 2^16 odd numbers, sieving primes cached per thread); time about
 * (hi − lo)·log log hi + √hi, memory O(√hi / log hi).
 * @throws EngineError(input) for ends that are not safe integers; EngineError(limit) for hi > 10^15.
 */
export function forEachPrimeBetween(lo: number, hi: number, visit: (p: number) => boolean | void): void {
  if (!Number.isSafeInteger(lo) || !Number.isSafeInteger(hi)) throw inputError(`prime walk ends ${lo}, ${hi} are not safe integers`);
  if (hi > Number(SIEVE_MAX_TO)) throw limitError(`prime walk end ${hi} is above the sieve limit 10^15`);
  if (lo < 2) lo = 2;
  if (hi < lo) return;
  if (lo === 2) {
    if (visit(2) === false) return;
    lo = 3;
  }
  const sieving = sievingPrimesFor(hi);
  const composite = new Uint8Array(SEGMENT_ODDS);
  // Segment from the odd number s: index i stands for s + 2i.
  for (let s = lo % 2 === 1 ? lo : lo + 1; s <= hi; s += 2 * SEGMENT_ODDS) {
    const count = Math.min(SEGMENT_ODDS, Math.floor((hi - s) / 2) + 1);
    const e = s + 2 * (count - 1);
    composite.fill(0, 0, count);
    for (let k = 1; k < sieving.length; k++) {
      const p = sieving[k]!;
      if (p * p > e) break;
      // The first odd multiple of p that is at least max(p², s).
      const r = s % p;
      let m = r === 0 ? s : s + (p - r);
      if (m < p * p) m = p * p;
      if (m % 2 === 0) m += p;
      for (let i = (m - s) / 2; i < count; i += p) composite[i] = 1;
    }
    for (let i = 0; i < count; i++) if (composite[i] === 0 && visit(s + 2 * i) === false) return;
  }
}
