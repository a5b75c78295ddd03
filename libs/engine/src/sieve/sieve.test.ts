import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { combinePrimeBlockList, combinePrimeBlocks } from './combine';
import type { PrimeBlock } from './prime-block';
import { primeBlockFromJson, primeBlockToJson } from './prime-block-json';
import { MAX_PATTERN_DIAMETER } from './pattern';
import { countConstellation, countPrimes, primeGapStatistics, splitSieveRange } from './queries';
import { sievePrimeBlock } from './range';
import { isPrimeByTrialDivision, isPrimeMillerRabin, naivePrimes } from '../../test/naive-primes';

// One pass over [0, 10^9], cut at the powers of ten and combined: the running totals give π(10^k)
// and the twin counts at every 10^k, and exercise block combination on the way.
const decades: PrimeBlock[] = [];
{
  let total: PrimeBlock | null = null;
  let from = 0n;
  for (let k = 1; k <= 9; k++) {
    const to = 10n ** BigInt(k);
    const block = sievePrimeBlock(from, to, { patterns: [[0, 2]] });
    total = total ? combinePrimeBlocks(total, block) : block;
    decades.push(total);
    from = to + 1n;
  }
}

describe('π(10^k) and twin primes below 10^k, k ≤ 9', () => {
  // π(10^k): OEIS A006880.
  const PI = [4, 25, 168, 1229, 9592, 78498, 664579, 5761455, 50847534];
  // Twin prime pairs (p, p + 2) with p + 2 < 10^k: OEIS A007508 (its first term 2 counts (3,5), (5,7)).
  // Our convention counts n with n, n + 2 prime and n + 2 ≤ 10^k; 10^k is not prime, so they agree.
  const TWINS = [2, 8, 35, 205, 1224, 8169, 58980, 440312, 3424506];
  it.each(PI.map((v, i) => [i + 1, v]))('π(10^%i) = %i (OEIS A006880)', (k, v) => {
    expect(decades[k - 1]!.primeCount).toBe(v);
  });
  it.each(TWINS.map((v, i) => [i + 1, v]))('twin pairs below 10^%i = %i (OEIS A007508)', (k, v) => {
    expect(decades[k - 1]!.patterns[0]!.count).toBe(v);
  });
  it('knows the first and last twin pair below 10^9 and the last prime below 10^9', () => {
    const t = decades[8]!.patterns[0]!;
    expect(t.first).toBe(3n);
    // 999999937 is the largest prime below 10^9 (OEIS A003618, from memory); checked by trial division too.
    expect(decades[8]!.lastPrime).toBe(999_999_937n);
    expect(isPrimeByTrialDivision(Number(t.last!)) && isPrimeByTrialDivision(Number(t.last!) + 2)).toBe(true);
  });
});

describe('gaps', () => {
  // Maximal prime gaps and the primes that start them, up to 10^8: OEIS A005250 (gaps) and
  // A002386 (primes), values from memory; the naive check below recomputes those up to 10^6.
  const RECORDS: Array<[number, number]> = [
    [1, 2], [2, 3], [4, 7], [6, 23], [8, 89], [14, 113], [18, 523], [20, 887], [22, 1129], [34, 1327],
    [36, 9551], [44, 15683], [52, 19609], [72, 31397], [86, 155921], [96, 360653], [112, 370261],
    [114, 492113], [118, 1349533], [132, 1357201], [148, 2010733], [154, 4652353], [180, 17051707],
    [210, 20831323], [220, 47326693],
  ];
  const stats = primeGapStatistics(0, 100_000_000);
  it('finds the maximal gaps below 10^8 (OEIS A005250, A002386)', () => {
    expect(stats.records.map((r) => [r.gap, Number(r.after)])).toEqual(RECORDS);
  });
  it('has a histogram summing to π − 1 and to the span of the primes', () => {
    let pairs = 0;
    let span = 0;
    for (const [g, c] of stats.histogram) {
      pairs += c;
      span += g * c;
    }
    expect(pairs).toBe(5761455 - 1); // π(10^8), OEIS A006880
    expect(span).toBe(99999989 - 2); // 99999989: the largest prime below 10^8 (trial division below)
    expect(isPrimeByTrialDivision(99999989)).toBe(true);
  });
  it('agrees with a naive gap scan up to 10^6', () => {
    const primes = naivePrimes(0, 1_000_000);
    const hist = new Map<number, number>();
    const records: Array<[number, number]> = [];
    let max = 0;
    for (let i = 1; i < primes.length; i++) {
      const g = primes[i]! - primes[i - 1]!;
      hist.set(g, (hist.get(g) ?? 0) + 1);
      if (g > max) records.push([(max = g), primes[i - 1]!]);
    }
    const s = primeGapStatistics(0, 1_000_000);
    expect([...s.histogram].sort((a, b) => a[0] - b[0])).toEqual([...hist].sort((a, b) => a[0] - b[0]));
    expect(s.records.map((r) => [r.gap, Number(r.after)])).toEqual(records);
  });
});

describe('input checks', () => {
  it.each([
    [() => sievePrimeBlock(10, 5), /empty range: from 10 is above to 5/],
    [() => sievePrimeBlock(0, 10n ** 15n + 1n), /above the sieve limit/],
    [() => sievePrimeBlock(-1, 5), /negative/],
    [() => sievePrimeBlock(0, 1.5), /not a safe integer/],
    [() => sievePrimeBlock(0, '12x'), /not a non-negative integer/],
    [() => countConstellation([0, 2, 4], 0, 100), /not admissible.*mod 3/],
    [() => countConstellation([0, 2, 2], 0, 100), /duplicate offset 2/],
    [() => countConstellation([0, 2_000_000], 0, 100), /diameter 2000000 is above/],
  ])('rejects bad input %#', (f, message) => {
    expect(f).toThrow(EngineError);
    expect(f).toThrow(message);
  });
  it('counts a repeated twin pattern as the first (the second goes through the general pattern path)', () => {
    const [a, b] = sievePrimeBlock(0, '1e8', { patterns: [[0, 2], [0, 2]] }).patterns;
    expect(a!.count).toBe(440312); // twin pairs below 10^8 (OEIS A007508)
    expect(b).toEqual(a);
  });
  it('counts a pattern of the widest accepted diameter across segments (its look-ahead fits the buffer)', () => {
    // {0, 4, 10^6}: n, n + 4, n + 10^6 all prime; checked against a plain unsegmented sieve.
    const H = [0, 4, MAX_PATTERN_DIAMETER];
    const to = 31_000_000;
    const isP = new Uint8Array(to + 1).fill(1, 2);
    for (let p = 2; p * p <= to; p++) if (isP[p]) for (let m = p * p; m <= to; m += p) isP[m] = 0;
    let expected = 0;
    for (let n = 2; n + MAX_PATTERN_DIAMETER <= to; n++) if (isP[n] && isP[n + 4] && isP[n + MAX_PATTERN_DIAMETER]) expected++;
    expect(expected).toBeGreaterThan(1000);
    expect(countConstellation(H, 0, to).count).toBe(expected);
  });
  it('accepts decimal strings with an exponent, and finds the primes near 10^15', () => {
    expect(countPrimes('0', '1e3')).toBe(168);
    const lo = 10n ** 15n - 3000n;
    const expected: bigint[] = [];
    for (let n = lo; n <= 10n ** 15n; n++) if (isPrimeMillerRabin(n)) expected.push(n);
    const block = sievePrimeBlock(lo, '1e15', { gaps: true });
    expect(block.primeCount).toBe(expected.length);
    expect(block.firstPrime).toBe(expected[0]);
    expect(block.lastPrime).toBe(expected[expected.length - 1]);
  });
});

describe('combination and JSON', () => {
  it('round-trips a block through JSON', () => {
    const b = sievePrimeBlock(1000, 100_000, { gaps: true, patterns: [[0, 2, 6], [0, 4]] });
    expect(primeBlockFromJson(JSON.parse(JSON.stringify(primeBlockToJson(b))))).toEqual(b);
  });
  it('refuses blocks that are not adjacent or were made with other patterns', () => {
    const a = sievePrimeBlock(0, 100, { patterns: [[0, 2]] });
    expect(() => combinePrimeBlocks(a, sievePrimeBlock(102, 200, { patterns: [[0, 2]] }))).toThrow(/not adjacent/);
    const b = sievePrimeBlock(0, 100, { patterns: [[0, 2, 6]] });
    expect(() => combinePrimeBlocks(b, sievePrimeBlock(101, 200, { patterns: [[0, 4, 6]] }))).toThrow(/different patterns/);
    expect(() => combinePrimeBlocks(a, sievePrimeBlock(101, 200, { gaps: true, patterns: [[0, 2]] }))).toThrow(
      /different options/,
    );
  });
  it('carries the bucket-sieved large primes across segments as fresh starts do (near 10^12)', () => {
    // One pass over 4·10^7 integers (three segments; primes above 2^19 go through the buckets)
    // against 9 separately sieved pieces, each starting its progressions afresh.
    const from = 10n ** 12n - 12_345n;
    const to = from + 40_000_000n;
    const options = { gaps: true, patterns: [[0, 2], [0, 4, 6, 10, 12, 16]] };
    const pieces = splitSieveRange(from, to, 9).map((r) => sievePrimeBlock(r.from, r.to, options));
    expect(primeBlockToJson(combinePrimeBlockList(pieces))).toEqual(primeBlockToJson(sievePrimeBlock(from, to, options)));
  });
  it('splits a range into adjacent parts that cover it', () => {
    const parts = splitSieveRange(17, 1_000_003, 7);
    expect(parts[0]!.from).toBe(17n);
    expect(parts[parts.length - 1]!.to).toBe(1_000_003n);
    for (let i = 1; i < parts.length; i++) expect(parts[i]!.from).toBe(parts[i - 1]!.to + 1n);
    expect(combinePrimeBlockList(parts.map((p) => sievePrimeBlock(p.from, p.to))).primeCount).toBe(
      countPrimes(17, 1_000_003),
    );
  });
});
