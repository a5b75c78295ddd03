import { describe, expect, it } from 'vitest';
import { isPrime } from './is-prime';
import { isSmallPrime } from './small-primes';

describe('isPrime', () => {
  it('agrees with trial division below 20 000', () => {
    for (let n = -5; n <= 20_000; n++) expect(isPrime(BigInt(n)), String(n)).toBe(isSmallPrime(n));
  });

  it('counts π(10^4) = 1229 (OEIS A006880)', () => {
    let count = 0;
    for (let n = 0n; n <= 10_000n; n++) if (isPrime(n)) count++;
    expect(count).toBe(1229);
  });

  // Mersenne numbers 2^p − 1: prime for p = 61, 89, 107, 127 (exponents OEIS A000043); composite
  // for p = 67 (193 707 721 · 761 838 257 287, Cole 1903) and p = 101 (from memory: not in A000043).
  it.each([
    [61n, true],
    [89n, true],
    [107n, true],
    [127n, true],
    [67n, false],
    [101n, false],
  ])('2^%s − 1 prime: %s', (p, prime) => {
    expect(isPrime(2n ** p - 1n)).toBe(prime);
  });

  it('the two factors of 2^67 − 1 are prime (Cole 1903)', () => {
    expect(isPrime(193_707_721n)).toBe(true);
    expect(isPrime(761_838_257_287n)).toBe(true);
  });

  // Least strong pseudoprimes to the first k prime bases, k = 1 … 12 (OEIS A014233, from memory):
  // each passes the first k rounds, so only the later bases unmask it.
  it.each([
    2047n,
    1_373_653n,
    25_326_001n,
    3_215_031_751n,
    2_152_302_898_747n,
    3_474_749_660_383n,
    341_550_071_728_321n,
    3_825_123_056_546_413_051n,
    318_665_857_834_031_151_167_461n,
  ])('%s is composite', (n) => {
    expect(isPrime(n)).toBe(false);
  });

  it('Carmichael numbers are composite (OEIS A002997)', () => {
    for (const n of [561n, 1105n, 1729n, 2465n, 2821n, 6601n, 8911n]) expect(isPrime(n), String(n)).toBe(false);
  });
});
