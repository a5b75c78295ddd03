import { inputError, limitError } from '../errors';
import { isSmallPrime, primesUpTo } from '../primes/small-primes';

/** Largest level accepted by the product formulas (primorial, totient, occurrence counts). */
export const MAX_PRODUCT_LEVEL = 1_000_000;

/**
 * Checks that p is a prime usable as a wheel level (2 ≤ p ≤ max).
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > max.
 */
export function checkLevel(p: number, max = MAX_PRODUCT_LEVEL): void {
  if (!Number.isSafeInteger(p) || !isSmallPrime(p)) throw inputError(`wheel level ${p} is not a prime`);
  if (p > max) throw limitError(`wheel level ${p} is above the limit ${max}`);
}

/** The primes q ≤ p of level p, as numbers. @throws EngineError as {@link checkLevel}. */
export function levelPrimes(p: number): number[] {
  checkLevel(p);
  return Array.from(primesUpTo(p));
}

/** Product of bigints by a balanced tree (fast for many factors). */
export function productTree(factors: readonly bigint[]): bigint {
  if (factors.length === 0) return 1n;
  let layer = factors.slice();
  while (layer.length > 1) {
    const next: bigint[] = [];
    for (let i = 0; i < layer.length; i += 2) next.push(i + 1 < layer.length ? layer[i]! * layer[i + 1]! : layer[i]!);
    layer = next;
  }
  return layer[0]!;
}

/**
 * The primorial p# = ∏_{q ≤ p} q (the modulus of wheel level p).
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > 10^6.
 */
export function primorial(p: number): bigint {
  return productTree(levelPrimes(p).map(BigInt));
}

/**
 * φ(p#) = ∏_{q ≤ p} (q − 1): the number of members of wheel level p (OEIS A005867).
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > 10^6.
 */
export function primorialTotient(p: number): bigint {
  return productTree(levelPrimes(p).map((q) => BigInt(q - 1)));
}

/** The prime before p (p ≥ 3), or 1 for p = 2 (level "1" is the single residue 0 mod 1). */
export function previousPrime(p: number): number {
  for (let q = p - 1; q >= 2; q--) if (isSmallPrime(q)) return q;
  return 1;
}

/** The least prime above n. */
export function nextPrime(n: number): number {
  let q = Math.max(2, Math.floor(n) + 1);
  while (!isSmallPrime(q)) q++;
  return q;
}
