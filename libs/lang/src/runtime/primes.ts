import { forEachPrimeBetween } from '@cribra/engine';
import { limitError, type SourceSpan } from '../errors';

/** Prime ranges are enumerated up to this bound (the engine's segmented walk stays cheap there). */
export const PRIME_RANGE_MAX = 10n ** 15n;

/** Visits the primes p with lo ≤ p ≤ hi in increasing order (the engine's walk); stops when `visit` returns false. */
export function forEachPrime(lo: bigint, hi: bigint, span: SourceSpan, visit: (p: bigint) => boolean | void): void {
  if (hi > PRIME_RANGE_MAX) throw limitError(`prime ranges end at 10^15 at most, got ${hi}`, span);
  if (lo < 2n) lo = 2n;
  if (hi < lo) return;
  forEachPrimeBetween(Number(lo), Number(hi), (p) => visit(BigInt(p)));
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
