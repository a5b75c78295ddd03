import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { admissibility } from '../tuple';
import { combinePrimeBlockList } from './combine';
import { primeBlockToJson } from './prime-block-json';
import { sievePrimeBlock } from './range';
import { isPrimeByTrialDivision } from '../../test/naive-primes';

/** Everything a block reports, recomputed by trial division over [a, b] (independent of the sieve). */
function naiveSummary(a: number, b: number, patterns: number[][]) {
  const isPrime = (n: number): boolean => isPrimeByTrialDivision(n);
  const primes: number[] = [];
  for (let n = a; n <= b; n++) if (isPrime(n)) primes.push(n);
  const histogram = new Map<number, number>();
  const records: Array<[number, number]> = [];
  let max = 0;
  for (let i = 1; i < primes.length; i++) {
    const g = primes[i]! - primes[i - 1]!;
    histogram.set(g, (histogram.get(g) ?? 0) + 1);
    if (g > max) records.push([(max = g), primes[i - 1]!]);
  }
  const occurrences = patterns.map((H) => {
    const ns = primes.filter((n) => n + H[H.length - 1]! <= b && H.every((h) => isPrime(n + h)));
    return { count: ns.length, first: ns[0] ?? null, last: ns[ns.length - 1] ?? null };
  });
  return { count: primes.length, first: primes[0] ?? null, last: primes[primes.length - 1] ?? null, histogram, records, occurrences };
}

// Admissible patterns with diameter ≤ 40 made of even offsets.
const pattern = fc
  .uniqueArray(fc.integer({ min: 1, max: 20 }), { minLength: 1, maxLength: 5 })
  .map((xs) => [0, ...xs.map((x) => 2 * x)].sort((x, y) => x - y))
  .filter((H) => admissibility(H).admissible);

// Short ranges: near 0, below 10^7, and anywhere below 10^12 (shorter there: trial division is slow).
const span = (maxStart: number, maxLength: number) =>
  fc
    .tuple(fc.integer({ min: 0, max: maxStart }), fc.integer({ min: 0, max: maxLength }))
    .map(([a, len]) => [a, a + len] as const);
const range = fc.oneof(span(5000, 1500), span(10_000_000, 1500), span(10 ** 12 - 2000, 300));

const toNum = (v: bigint | null): number | null => (v === null ? null : Number(v));

describe('the sieve against trial division', () => {
  it('agrees on π, first/last prime, gaps and pattern occurrences for random ranges', () => {
    fc.assert(
      fc.property(range, fc.array(pattern, { minLength: 1, maxLength: 3 }), ([a, b], patterns) => {
        const block = sievePrimeBlock(a, b, { gaps: true, patterns });
        const naive = naiveSummary(a, b, patterns);
        expect(block.primeCount).toBe(naive.count);
        expect(toNum(block.firstPrime)).toBe(naive.first);
        expect(toNum(block.lastPrime)).toBe(naive.last);
        expect(new Map(block.gaps!.histogram)).toEqual(naive.histogram);
        expect(block.gaps!.records.map((r) => [r.gap, Number(r.after)])).toEqual(naive.records);
        block.patterns.forEach((p, i) => {
          expect({ count: p.count, first: toNum(p.first), last: toNum(p.last) }).toEqual(naive.occurrences[i]);
        });
      }),
      { numRuns: 100 },
    );
  });
});

describe('small ranges, exhaustively', () => {
  it('agrees with trial division on every range [a, b] ⊆ [0, 100] (2, 3, 5 and the first bytes)', () => {
    const patterns = [[0, 2], [0, 4], [0, 6], [0, 2, 6], [0, 4, 6], [0, 2, 6, 8]];
    const mismatches: string[] = [];
    for (let a = 0; a <= 100; a++) {
      for (let b = a; b <= 100; b++) {
        const block = sievePrimeBlock(a, b, { gaps: true, patterns });
        const naive = naiveSummary(a, b, patterns);
        const got = {
          count: block.primeCount,
          first: toNum(block.firstPrime),
          last: toNum(block.lastPrime),
          histogram: [...block.gaps!.histogram],
          occurrences: block.patterns.map((p) => ({ count: p.count, first: toNum(p.first), last: toNum(p.last) })),
        };
        const want = { ...naive, histogram: [...naive.histogram].sort((x, y) => x[0] - y[0]) };
        delete (want as { records?: unknown }).records;
        if (JSON.stringify(got) !== JSON.stringify(want)) mismatches.push(`[${a}, ${b}]`);
      }
    }
    expect(mismatches).toEqual([]);
  });
});

describe('block combination', () => {
  it('equals the one-shot block for random splits', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 2_000_000 }),
        fc.integer({ min: 1, max: 200_000 }),
        fc.uniqueArray(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 12 }),
        fc.array(pattern, { minLength: 1, maxLength: 3 }),
        (a, len, cuts, patterns) => {
          const b = a + len;
          // Cut points (some pieces shorter than the pattern diameters).
          const points = [...new Set(cuts.map((c) => a + Math.floor(c * len)))].filter((p) => p < b).sort((x, y) => x - y);
          const ends = [...points, b];
          const blocks = [];
          let from = a;
          for (const end of ends) {
            if (end < from) continue;
            blocks.push(sievePrimeBlock(from, end, { gaps: true, patterns }));
            from = end + 1;
          }
          const whole = sievePrimeBlock(a, b, { gaps: true, patterns });
          expect(primeBlockToJson(combinePrimeBlockList(blocks))).toEqual(primeBlockToJson(whole));
        },
      ),
      { numRuns: 100 },
    );
  });
});
