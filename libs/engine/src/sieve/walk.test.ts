import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { isPrimeByTrialDivision, isPrimeMillerRabin } from '../../test/naive-primes';
import { sievePrimeBlock } from './range';
import { forEachPrimeBetween } from './walk';

const walk = (lo: number, hi: number): number[] => {
  const out: number[] = [];
  forEachPrimeBetween(lo, hi, (p) => {
    out.push(p);
  });
  return out;
};

describe('forEachPrimeBetween', () => {
  it('visits the 78 498 primes below 10^6 (OEIS A006880), each prime by trial division', () => {
    const primes = walk(0, 1_000_000);
    expect(primes.length).toBe(78_498);
    expect(primes.every((p, i) => isPrimeByTrialDivision(p) && (i === 0 || p > primes[i - 1]!))).toBe(true);
  });

  it('agrees with Miller–Rabin on every integer of a range above 10^12 spanning several segments', () => {
    const lo = 1_000_000_000_000 - 70_001;
    const hi = 1_000_000_000_000 + 200_000;
    const primes = new Set(walk(lo, hi));
    let count = 0;
    for (let n = lo; n <= hi; n++) {
      const prime = n % 2 === 1 && isPrimeMillerRabin(BigInt(n));
      expect(primes.has(n)).toBe(prime);
      if (prime) count++;
    }
    expect(primes.size).toBe(count);
    // And with the sieve's count over the same range (a third path).
    expect(sievePrimeBlock(lo, hi).primeCount).toBe(count);
  });

  it('agrees with trial division on random short ranges', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 3_000_000 }), fc.integer({ min: 0, max: 400 }), (lo, len) => {
        const expected: number[] = [];
        for (let n = lo; n <= lo + len; n++) if (isPrimeByTrialDivision(n)) expected.push(n);
        expect(walk(lo, lo + len)).toEqual(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('handles the ends: 2, single numbers, empty ranges', () => {
    expect(walk(0, 2)).toEqual([2]);
    expect(walk(2, 3)).toEqual([2, 3]);
    expect(walk(9, 9)).toEqual([]);
    expect(walk(97, 97)).toEqual([97]);
    expect(walk(10, 5)).toEqual([]);
    expect(walk(-5, 10)).toEqual([2, 3, 5, 7]);
  });

  it('stops when the visitor answers false, and lets its errors through', () => {
    const seen: number[] = [];
    forEachPrimeBetween(0, 1_000_000, (p) => {
      seen.push(p);
      return seen.length < 5;
    });
    expect(seen).toEqual([2, 3, 5, 7, 11]);
    expect(() =>
      forEachPrimeBetween(0, 100, (p) => {
        if (p > 50) throw new Error('enough');
      }),
    ).toThrow('enough');
  });

  it('refuses ends that are not safe integers and ends above 10^15', () => {
    expect(() => walk(0, 2 ** 53)).toThrow(EngineError);
    expect(() => walk(0.5, 10)).toThrow(/not safe integers/);
    expect(() => walk(0, 1e15 + 1)).toThrow(/above the sieve limit/);
  });
});
