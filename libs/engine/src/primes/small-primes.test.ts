import { describe, expect, it } from 'vitest';
import { primesUpTo, isSmallPrime } from './small-primes';

describe('primesUpTo', () => {
  // π(10^k) for k = 1..7: OEIS A006880.
  it.each([
    [10, 4],
    [100, 25],
    [1000, 168],
    [10_000, 1229],
    [100_000, 9592],
    [1_000_000, 78498],
    [10_000_000, 664579],
  ])('π(%i) = %i (OEIS A006880)', (n, count) => {
    expect(primesUpTo(n).length).toBe(count);
  });
  it('agrees with trial division below 2000', () => {
    const set = new Set(primesUpTo(2000));
    for (let n = 0; n <= 2000; n++) expect(set.has(n)).toBe(isSmallPrime(n));
  });
});
