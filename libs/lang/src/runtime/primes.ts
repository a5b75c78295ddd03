import { primesUpTo } from '@cribra/engine';
import { limitError, type SourceSpan } from '../errors';

/** Prime ranges are enumerated up to this bound (the segmented walk below stays cheap there). */
export const PRIME_RANGE_MAX = 10n ** 15n;
const SEGMENT = 1 << 16;

let basePrimes: Uint32Array = new Uint32Array(0);
let baseLimit = 0;

function primesTo(n: number): Uint32Array {
  if (n > baseLimit) {
    baseLimit = Math.max(n, 1 << 16);
    basePrimes = primesUpTo(baseLimit);
  }
  return basePrimes;
}

/**
 * Visits the primes p with lo ≤ p ≤ hi in increasing order (segmented sieve of Eratosthenes with
 * base primes from the engine); stops when `visit` returns false.
 */
export function forEachPrime(lo: bigint, hi: bigint, span: SourceSpan, visit: (p: bigint) => boolean | void): void {
  if (hi > PRIME_RANGE_MAX) throw limitError(`prime ranges end at 10^15 at most, got ${hi}`, span);
  if (lo < 2n) lo = 2n;
  if (hi < lo) return;
  const loN = Number(lo);
  const hiN = Number(hi);
  const base = primesTo(Math.floor(Math.sqrt(hiN)) + 1);
  if (hiN <= baseLimit) {
    for (const p of base) {
      if (p < loN) continue;
      if (p > hiN) return;
      if (visit(BigInt(p)) === false) return;
    }
    return;
  }
  const mark = new Uint8Array(SEGMENT);
  for (let start = loN; start <= hiN; start += SEGMENT) {
    const end = Math.min(hiN, start + SEGMENT - 1);
    mark.fill(0);
    for (const p of base) {
      if (p * p > end) break;
      let m = Math.max(p * p, Math.ceil(start / p) * p);
      for (; m <= end; m += p) mark[m - start] = 1;
    }
    for (let i = 0; i <= end - start; i++) {
      if (!mark[i] && start + i >= 2 && visit(BigInt(start + i)) === false) return;
    }
  }
}

// Primality of single values is the engine's (Miller–Rabin, a proof below 3.3·10^24).
export { isPrime } from '@cribra/engine';

/** Rough upper bound of the number of primes in [lo, hi] (for size checks before enumerating). */
export function primeCountBound(lo: bigint, hi: bigint): number {
  if (hi < lo) return 0;
  const x = Number(hi);
  if (x < 100) return 25;
  return Math.ceil((1.26 * x) / Math.log(x)) - (lo > 100n ? Math.floor((Number(lo) / Math.log(Number(lo))) * 0.9) : 0);
}
