import { limitError } from '../errors';

const SMALL_PRIME_LIMIT = 2_000_000_000;

/**
 * All primes ≤ n, by a plain sieve of Eratosthenes over odd numbers.
 * @throws EngineError(limit) when n exceeds 2·10^9 (use the segmented sieve for real ranges).
 */
export function primesUpTo(n: number): Uint32Array {
  if (!Number.isSafeInteger(n) || n < 2) return new Uint32Array(0);
  if (n > SMALL_PRIME_LIMIT) throw limitError(`primesUpTo(${n}): bound above ${SMALL_PRIME_LIMIT}`);
  const size = (n - 1) >>> 1; // index i stands for 2i + 3
  const composite = new Uint8Array(size);
  for (let i = 0; ; i++) {
    const p = 2 * i + 3;
    if (p * p > n) break;
    if (composite[i]) continue;
    for (let j = (p * p - 3) >>> 1; j < size; j += p) composite[j] = 1;
  }
  let count = 1;
  for (let i = 0; i < size; i++) if (!composite[i]) count++;
  const out = new Uint32Array(count);
  out[0] = 2;
  let k = 1;
  for (let i = 0; i < size; i++) if (!composite[i]) out[k++] = 2 * i + 3;
  return out;
}

/** Primality of a safe integer by trial division (for small arguments such as wheel levels). */
export function isSmallPrime(n: number): boolean {
  if (!Number.isSafeInteger(n) || n < 2) return false;
  if (n % 2 === 0) return n === 2;
  for (let d = 3; d * d <= n; d += 2) if (n % d === 0) return false;
  return true;
}

/** The primes q with a ≤ q ≤ b (both small), in increasing order. */
export function primesBetween(a: number, b: number): number[] {
  return Array.from(primesUpTo(b)).filter((q) => q >= a);
}
