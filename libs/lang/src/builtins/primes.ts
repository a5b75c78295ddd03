import { combinePrimeBlockList, partHooks, type PrimeBlock, sievePrimeBlock } from '@cribra/engine';
import { domainError, limitError } from '../errors';
import { IntRange, SiftRecord, Table, Tuple } from '../values/types';
import { argRange, argTuple, type Builtin, type CallContext, compactInt, defineBuiltins, oldSpelling } from './registry';

/** Longest piece sieved in one engine call (the pieces' summaries are combined exactly). */
const BLOCK = 10_000_000_000n;
/** Largest range end the sieve accepts. */
const SIEVE_MAX = 10n ** 15n;

interface SieveAsk {
  gaps: boolean;
  patterns: bigint[][];
}

/**
 * Sieves lo..hi with the engine's segmented sieve (pieces of at most 10^10, combined exactly); the
 * engine reports progress every few segments and checks the time limit and cancellation at the same
 * points.
 */
function sieveRange(r: IntRange, ask: SieveAsk, c: CallContext, fn: string): PrimeBlock {
  if (r.primesOnly) throw domainError(`${fn}: give a plain range a..b (the function finds the primes itself)`, c.argSpans[0]);
  const lo = r.lo < 0n ? 0n : r.lo;
  const hi = r.hi;
  if (hi < lo) throw domainError(`${fn}: the range ${r.lo}..${r.hi} is empty`, c.span);
  if (hi > SIEVE_MAX) throw limitError(`${fn}: ranges end at 10^15 at most`, c.span);
  c.tick(1000);
  const work = c.work(`sieving ${compactInt(lo)} … ${compactInt(hi)}`);
  work.onProgress?.(0);
  const total = Number(hi - lo + 1n);
  const blocks: PrimeBlock[] = [];
  for (let from = lo; from <= hi; from += BLOCK) {
    const to = from + BLOCK - 1n < hi ? from + BLOCK - 1n : hi;
    const part = partHooks(work, Number(from - lo) / total, Number(to - lo + 1n) / total);
    blocks.push(sievePrimeBlock(from, to, { gaps: ask.gaps, patterns: ask.patterns, ...part }));
  }
  return combinePrimeBlockList(blocks);
}

const TWIN = [0n, 2n];

const primes: Builtin[] = [
  {
    name: 'ledger', area: 'primes', minArgs: 1, maxArgs: 1,
    signature: 'ledger(a..b) → record (from, to, primes, twins, maxgap, after)',
    doc: 'Prime statistics of a..b: π(b) − π(a−1), twin pairs (p, p+2) inside the range, the largest gap and the prime before it. Stored ledger ranges are read.',
    example: { source: 'ledger(1..100)', result: '(from: 1, to: 100, primes: 25, twins: 8, maxgap: 8, after: 89)' },
    call: (a, c) => {
      const r = argRange(a, 0, c, 'ledger');
      const s = c.data && !r.primesOnly && r.lo >= 0n ? c.data.ledger(r.lo, r.hi + 1n) : null;
      if (s && s.constellations['twin'] !== undefined) {
        return SiftRecord.of([
          ['from', r.lo], ['to', r.hi], ['primes', s.primeCount], ['twins', s.constellations['twin']!],
          ['maxgap', BigInt(s.largestGap?.gap ?? 0)], ['after', s.largestGap?.start ?? 0n],
        ]);
      }
      const b = sieveRange(r, { gaps: true, patterns: [TWIN] }, c, 'ledger');
      const top = b.gaps!.records[b.gaps!.records.length - 1];
      return SiftRecord.of([
        ['from', r.lo], ['to', r.hi], ['primes', BigInt(b.primeCount)], ['twins', BigInt(b.patterns[0]!.count)],
        ['maxgap', BigInt(top?.gap ?? 0)], ['after', top?.after ?? 0n],
      ]);
    },
  },
  {
    name: 'primecount', area: 'primes', minArgs: 1, maxArgs: 1, yieldsToCellNames: true,
    signature: 'primecount(x) → integer  (also π(x))', doc: 'π(x), the number of primes ≤ x (segmented sieve, x ≤ 10^15).',
    example: { source: 'primecount(10^6)', result: '78498' },
    call: (a, c) => primePi(a[0], c, 'primecount'),
  },
  {
    name: 'π', area: 'primes', minArgs: 1, maxArgs: 1,
    signature: 'π(x) → integer', doc: 'π(x), the number of primes ≤ x (same as primecount).',
    example: { source: 'π(100)', result: '25' },
    call: (a, c) => primePi(a[0], c, 'π'),
  },
  {
    name: 'constellations', area: 'primes', minArgs: 2, maxArgs: 2,
    signature: 'constellations(H, a..b) → record (pattern, count, first, last)',
    doc: 'The constellations of the admissible tuple H among the primes: n with n + h prime for all h ∈ H, a ≤ n and n + max H ≤ b.',
    example: { source: 'constellations({0, 2, 6}, 1..1000)', result: '(pattern: {0, 2, 6}, count: 15, first: 5, last: 881)' },
    call: (a, c) => {
      const h = argTuple(a, 0, c, 'constellations');
      const r = argRange(a, 1, c, 'constellations');
      const st = sieveRange(r, { gaps: false, patterns: [h] }, { ...c, argSpans: c.argSpans.slice(1) }, 'constellations').patterns[0]!;
      return SiftRecord.of([
        ['pattern', new Tuple(st.pattern.map(BigInt))], ['count', BigInt(st.count)],
        ['first', st.first ?? false], ['last', st.last ?? false],
      ]);
    },
  },
  {
    name: 'records', area: 'primes', minArgs: 1, maxArgs: 1,
    signature: 'records(a..b) → table (gap, after)',
    doc: 'Record gaps between consecutive primes of a..b (each larger than every earlier one; from 2 on, the maximal prime gaps).',
    example: { source: 'records(1..1000)', result: 'table (gap, after): (1, 2), (2, 3), (4, 7), (6, 23), (8, 89), (14, 113), (18, 523), (20, 887)' },
    call: (a, c) => {
      const b = sieveRange(argRange(a, 0, c, 'records'), { gaps: true, patterns: [] }, c, 'records');
      return new Table(['gap', 'after'], b.gaps!.records.map((g) => [BigInt(g.gap), g.after]));
    },
  },
  {
    name: 'primegaps', area: 'primes', minArgs: 1, maxArgs: 1,
    signature: 'primegaps(a..b) → table (gap, count)',
    doc: 'Histogram of the gaps between consecutive primes that both lie in a..b.',
    example: { source: 'primegaps(1..30)', result: 'table (gap, count): (1, 1), (2, 4), (4, 3), (6, 1)' },
    call: (a, c) => {
      const b = sieveRange(argRange(a, 0, c, 'primegaps'), { gaps: true, patterns: [] }, c, 'primegaps');
      return new Table(['gap', 'count'], [...b.gaps!.histogram].sort((x, y) => x[0] - y[0]).map(([g, n]) => [BigInt(g), BigInt(n)]));
    },
  },
];

function primePi(x: unknown, c: CallContext, fn: string): bigint {
  if (typeof x !== 'bigint') throw domainError(`${fn}: x must be an integer`, c.argSpans[0]);
  if (x < 2n) return 0n;
  return BigInt(sieveRange(new IntRange(0n, x, false), { gaps: false, patterns: [] }, c, fn).primeCount);
}

defineBuiltins(primes);
// The old spelling (hidden): its messages keep the old name, so old cells give the same outputs.
defineBuiltins([oldSpelling(primes.find((b) => b.name === 'primecount')!, 'primepi', (a, c) => primePi(a[0], c, 'primepi'))]);
