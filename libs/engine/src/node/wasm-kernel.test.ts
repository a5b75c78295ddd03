import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { combinePrimeBlocks, primeBlockToJson, sievePrimeBlock, type PrimeBlock } from '../sieve';
import { KERNEL_MAX_TO } from '../sieve/kernel';
import { MAX_PATTERN_DIAMETER } from '../sieve/pattern';
import { admissibility } from '../tuple';
import { isPrimeByTrialDivision } from '../../test/naive-primes';
import { sievePrimeBlockParallel } from './sieve-parallel';
import { sieveKernel, sieveKernelBuilt, sievePrimeBlockWasm } from './wasm-kernel';

// The WebAssembly kernel (built from libs/engine/assembly by the test setup) against the
// JavaScript sieve, trial division and published counts.

const kernel = sieveKernel();
const both = (a: number | string, b: number | string, options: { gaps?: boolean; patterns?: number[][] }) => ({
  wasm: primeBlockToJson(sievePrimeBlock(a, b, { ...options, kernel })),
  js: primeBlockToJson(sievePrimeBlock(a, b, options)),
});

// Admissible patterns of even offsets, diameter ≤ 60.
const pattern = fc
  .uniqueArray(fc.integer({ min: 1, max: 30 }), { minLength: 1, maxLength: 5 })
  .map((xs) => [0, ...xs.map((x) => 2 * x)].sort((x, y) => x - y))
  .filter((H) => admissibility(H).admissible);
const span = (maxStart: number, maxLength: number) =>
  fc.tuple(fc.integer({ min: 0, max: maxStart }), fc.integer({ min: 0, max: maxLength })).map(([a, len]) => [a, a + len] as const);

describe('the WebAssembly sieve kernel', () => {
  it('is built and loads', () => {
    expect(sieveKernelBuilt()).toBe(true);
    expect(kernel.lastTablePrime).toBe(127);
  });

  it('equals the JavaScript sieve (π, first/last, gaps, records, patterns, head/tail) on random ranges', () => {
    // Short ranges near 0 (the put-back table primes), anywhere below 2^40, and ranges of several
    // segments (15.7·10^6 integers each) so that the carried look-ahead and the pieces are crossed.
    const range = fc.oneof(span(3000, 3000), span(KERNEL_MAX_TO - 100_000, 100_000), span(10 ** 11, 2_000_000), span(10 ** 9, 40_000_000));
    fc.assert(
      fc.property(range, fc.array(pattern, { minLength: 0, maxLength: 4 }), fc.boolean(), fc.boolean(), ([a, b], patterns, gaps, twins) => {
        const ps = twins ? [[0, 2], ...patterns] : patterns;
        const { wasm, js } = both(a, b, { gaps, patterns: ps });
        expect(wasm).toEqual(js);
      }),
      { numRuns: 40 },
    );
  });

  it('agrees with trial division on π, first/last prime, gaps and occurrences for random short ranges', () => {
    const range = fc.oneof(span(5000, 2000), span(10_000_000, 2000), span(10 ** 12 - 3000, 300));
    fc.assert(
      fc.property(range, fc.array(pattern, { minLength: 1, maxLength: 3 }), ([a, b], patterns) => {
        const block = sievePrimeBlockWasm(a, b, { gaps: true, patterns });
        const primes: number[] = [];
        for (let n = a; n <= b; n++) if (isPrimeByTrialDivision(n)) primes.push(n);
        expect(block.primeCount).toBe(primes.length);
        expect(block.firstPrime).toBe(primes.length ? BigInt(primes[0]!) : null);
        expect(block.lastPrime).toBe(primes.length ? BigInt(primes[primes.length - 1]!) : null);
        const histogram = new Map<number, number>();
        for (let i = 1; i < primes.length; i++) histogram.set(primes[i]! - primes[i - 1]!, (histogram.get(primes[i]! - primes[i - 1]!) ?? 0) + 1);
        expect(new Map(block.gaps!.histogram)).toEqual(histogram);
        block.patterns.forEach((p, i) => {
          const H = patterns[i]!;
          const ns = primes.filter((n) => n + H[H.length - 1]! <= b && H.every((h) => isPrimeByTrialDivision(n + h)));
          expect([p.count, p.first, p.last]).toEqual([ns.length, ns.length ? BigInt(ns[0]!) : null, ns.length ? BigInt(ns[ns.length - 1]!) : null]);
        });
      }),
      { numRuns: 100 },
    );
  });

  it('agrees with trial division on every range [a, b] ⊆ [0, 140] (2, 3, 5 and the primes the tables put back)', () => {
    const patterns = [[0, 2], [0, 4], [0, 6], [0, 2, 6], [0, 4, 6], [0, 2, 6, 8]];
    const bad: string[] = [];
    for (let a = 0; a <= 140; a++) {
      for (let b = a; b <= 140; b++) {
        const block = sievePrimeBlockWasm(a, b, { gaps: true, patterns });
        const primes: number[] = [];
        for (let n = a; n <= b; n++) if (isPrimeByTrialDivision(n)) primes.push(n);
        const counts = patterns.map((H) => primes.filter((n) => n + H[H.length - 1]! <= b && H.every((h) => isPrimeByTrialDivision(n + h))).length);
        const gapSum = [...block.gaps!.histogram].reduce((s, [g, c]) => s + g * c, 0);
        const ok =
          block.primeCount === primes.length &&
          gapSum === (primes.length ? primes[primes.length - 1]! - primes[0]! : 0) &&
          JSON.stringify(block.patterns.map((p) => p.count)) === JSON.stringify(counts);
        if (!ok) bad.push(`[${a}, ${b}]`);
      }
    }
    expect(bad).toEqual([]);
  });

  describe('π(10^k) and twin pairs below 10^k through the kernel', () => {
    // π(10^k): OEIS A006880. Twin pairs (p, p + 2) with p + 2 < 10^k: OEIS A007508 (the sieve
    // counts n with n + 2 ≤ 10^k; 10^k is not prime, so the two agree).
    const PI = [4, 25, 168, 1229, 9592, 78498, 664579, 5761455, 50847534];
    const TWINS = [2, 8, 35, 205, 1224, 8169, 58980, 440312, 3424506];
    const decades: PrimeBlock[] = [];
    let total: PrimeBlock | null = null;
    let from = 0n;
    for (let k = 1; k <= 9; k++) {
      const to = 10n ** BigInt(k);
      const block = sievePrimeBlockWasm(from, to, { patterns: [[0, 2]] });
      total = total ? combinePrimeBlocks(total, block) : block;
      decades.push(total);
      from = to + 1n;
    }
    it.each(PI.map((v, i) => [i + 1, v]))('π(10^%i) = %i (OEIS A006880)', (k, v) => {
      expect(decades[k - 1]!.primeCount).toBe(v);
    });
    it.each(TWINS.map((v, i) => [i + 1, v]))('twin pairs below 10^%i = %i (OEIS A007508)', (k, v) => {
      expect(decades[k - 1]!.patterns[0]!.count).toBe(v);
    });
    it('π(10^10) = 455052511 (OEIS A006880) and 27412679 twin pairs below 10^10 (OEIS A007508), on 2 workers', async () => {
      const block = await sievePrimeBlockParallel(0, '1e10', { patterns: [[0, 2]], workers: 2, kernel: 'wasm' });
      expect([block.primeCount, block.patterns[0]!.count]).toEqual([455052511, 27412679]);
    });
  });

  it('gives the gap statistics of the JavaScript sieve below 10^8 (records: OEIS A005250 / A002386, checked there)', () => {
    const { wasm, js } = both(0, 100_000_000, { gaps: true });
    expect(wasm).toEqual(js);
    expect(wasm.gaps!.records.at(-1)).toEqual({ gap: 220, after: '47326693' });
  });

  it('counts the ledger constellations with gaps on a block near 10^10 as the JavaScript sieve does', () => {
    const patterns = [[0, 2], [0, 4], [0, 6], [0, 2, 6], [0, 4, 6], [0, 2, 6, 8]];
    const { wasm, js } = both(9_990_000_000, 9_999_999_999, { gaps: true, patterns });
    expect(wasm).toEqual(js);
  });

  it('reads a pattern of the widest accepted diameter across segments (its look-ahead fits)', () => {
    const wide = [0, 4, MAX_PATTERN_DIAMETER];
    expect(admissibility(wide).admissible).toBe(true);
    const { wasm, js } = both(0, 40_000_000, { patterns: [wide, [0, 2]] });
    expect(wasm).toEqual(js);
    expect(wasm.patterns[0]!.count).toBeGreaterThan(0);
  });

  it('leaves ranges ending at or above 2^40 to the JavaScript sieve (the same summary)', () => {
    const { wasm, js } = both(KERNEL_MAX_TO - 1000, KERNEL_MAX_TO + 1000, { gaps: true, patterns: [[0, 2]] });
    expect(wasm).toEqual(js);
  });

  it('runs on the worker threads: kernel and JavaScript sieve agree, and a bad choice is refused', async () => {
    const options = { gaps: true, patterns: [[0, 2], [0, 2, 6, 8]], workers: 2, blocks: 5 } as const;
    const wasm = await sievePrimeBlockParallel(10 ** 9, 10 ** 9 + 60_000_000, { ...options, kernel: 'wasm' });
    const js = await sievePrimeBlockParallel(10 ** 9, 10 ** 9 + 60_000_000, { ...options, kernel: 'js' });
    expect(primeBlockToJson(wasm)).toEqual(primeBlockToJson(js));
    await expect(sievePrimeBlockParallel(0, 100, { kernel: 'fast' as never })).rejects.toThrow(/kernel "fast" is not auto, wasm or js/);
  });
});
