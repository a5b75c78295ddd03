import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { isPrimeMillerRabin } from '../../test/naive-primes';
import { factorInteger } from './factor';
import { isPrime } from './is-prime';

const product = (f: Array<[bigint, number]>): bigint => f.reduce((acc, [p, e]) => acc * p ** BigInt(e), 1n);

describe('factorInteger', () => {
  it('splits the classical Fermat and Mersenne factorisations', () => {
    // 2^32 + 1 = 641 · 6 700 417 (Euler, 1732).
    expect(factorInteger(2n ** 32n + 1n)).toEqual([[641n, 1], [6700417n, 1]]);
    // 2^64 + 1 = 274 177 · 67 280 421 310 721 (Landry, 1880).
    expect(factorInteger(2n ** 64n + 1n)).toEqual([[274177n, 1], [67280421310721n, 1]]);
    // 2^67 − 1 = 193 707 721 · 761 838 257 287 (Cole, 1903).
    expect(factorInteger(2n ** 67n - 1n)).toEqual([[193707721n, 1], [761838257287n, 1]]);
    // 10! = 2^8 · 3^4 · 5^2 · 7 (common practice: Legendre's formula).
    expect(factorInteger(3628800n)).toEqual([[2n, 8], [3n, 4], [5n, 2], [7n, 1]]);
  });

  it('handles 1, primes, prime powers and squares of large primes', () => {
    expect(factorInteger(1n)).toEqual([]);
    expect(factorInteger(2n)).toEqual([[2n, 1]]);
    expect(factorInteger(2n ** 61n - 1n)).toEqual([[2n ** 61n - 1n, 1]]); // Mersenne prime M61 (OEIS A000043 lists 61)
    expect(factorInteger(3n ** 40n)).toEqual([[3n, 40]]);
    expect(factorInteger((2n ** 31n - 1n) ** 2n)).toEqual([[2n ** 31n - 1n, 2]]); // M31 is prime (OEIS A000043 lists 31)
    expect(factorInteger(4099n * 4099n * 4111n)).toEqual([[4099n, 2], [4111n, 1]]);
  });

  it('factors products of random primes of up to 26 bits back into them (primes checked by an independent Miller–Rabin)', () => {
    const prime = fc.bigInt({ min: 2n, max: 2n ** 26n }).map((x) => {
      while (!isPrime(x)) x++;
      return x;
    });
    fc.assert(
      fc.property(fc.array(prime, { minLength: 1, maxLength: 3 }), (ps) => {
        const n = ps.reduce((a, b) => a * b, 1n);
        const f = factorInteger(n);
        expect(product(f)).toBe(n);
        expect(f.every(([p]) => isPrimeMillerRabin(p))).toBe(true);
        expect(f.map(([p]) => p)).toEqual([...new Set(ps)].sort((a, b) => (a < b ? -1 : 1)));
      }),
      { numRuns: 150 },
    );
  });

  it('splits the hardest kind within the limit: two primes of 12 digits', () => {
    const below = (x: bigint): bigint => {
      do x--;
      while (!isPrimeMillerRabin(x));
      return x;
    };
    const p = below(10n ** 12n);
    const q = below(p);
    expect(factorInteger(p * q)).toEqual([[q, 1], [p, 1]]);
  });

  it('refuses n < 1 and n above 10^24, and stops when asked', () => {
    expect(() => factorInteger(0n)).toThrow(EngineError);
    expect(() => factorInteger(-6n)).toThrow(/not a positive integer/);
    expect(() => factorInteger(10n ** 24n + 1n)).toThrow(/above the limit/);
    expect(() => factorInteger(999999999989n * 999999999959n, { shouldStop: () => true })).toThrow(/stopped on request while factoring/);
  });
});
