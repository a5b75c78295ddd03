import { primesUpTo } from '../primes/small-primes';

/** Largest upper end `to` the sieve accepts: 10^15 (all positions stay exact as numbers). */
export const SIEVE_MAX_TO = 10n ** 15n;

let sievingCache: Uint32Array = new Uint32Array(0);
let sievingBound = 0;

/** Every prime ≤ √to, and possibly more (cached per thread, grown on demand). */
export function sievingPrimesFor(to: number): Uint32Array {
  let r = Math.floor(Math.sqrt(to));
  while (r * r > to) r--;
  while ((r + 1) * (r + 1) <= to) r++;
  if (r > sievingBound) {
    sievingCache = primesUpTo(Math.max(r, 2 * sievingBound, 1000));
    sievingBound = Math.max(r, 2 * sievingBound, 1000);
  }
  return sievingCache;
}
