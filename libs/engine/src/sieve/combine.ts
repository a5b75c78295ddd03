import { inputError } from '../errors';
import type { GapRecord, GapStatistics, PatternStatistics, PrimeBlock } from './prime-block';

/**
 * Combines the summaries of two adjacent ranges [a.from, a.to] and [a.to + 1, b.to] into the summary
 * of their union, exactly as if it had been sieved at once: the gap between a's last and b's first
 * prime is added once, and the pattern occurrences that straddle the boundary are found among a's
 * tail primes and b's head primes (the windows are as wide as the largest pattern diameter).
 * @throws EngineError(input) when the ranges are not adjacent, or the blocks were made with different
 *   patterns or one with and one without gaps.
 */
export function combinePrimeBlocks(a: PrimeBlock, b: PrimeBlock): PrimeBlock {
  if (a.to + 1n !== b.from) {
    throw inputError(`blocks [${a.from}, ${a.to}] and [${b.from}, ${b.to}] are not adjacent`);
  }
  if (a.window !== b.window || a.patterns.length !== b.patterns.length || (a.gaps === null) !== (b.gaps === null)) {
    throw inputError(`blocks [${a.from}, ${a.to}] and [${b.from}, ${b.to}] were computed with different options`);
  }
  a.patterns.forEach((p, i) => {
    const q = b.patterns[i]!.pattern;
    if (p.pattern.length !== q.length || p.pattern.some((h, j) => h !== q[j])) {
      throw inputError(`blocks hold different patterns: {${p.pattern.join(',')}} and {${q.join(',')}}`);
    }
  });
  const W = a.window;
  const lengthB = b.to - a.to; // ≥ 1
  // Primes near the boundary, as positions relative to a.to (a's are ≤ 0, b's are ≥ 1).
  const near = new Set<number>();
  for (const t of a.tailPrimes) near.add(-t);
  for (const u of b.headPrimes) near.add(u + 1);
  const patterns = a.patterns.map((pa, i) => straddle(pa, b.patterns[i]!, a.tailPrimes, near, lengthB, a.to));

  const headPrimes = [...a.headPrimes];
  const shiftB = b.from - a.from;
  if (shiftB < BigInt(W)) for (const u of b.headPrimes) if (Number(shiftB) + u < W) headPrimes.push(Number(shiftB) + u);
  const tailPrimes = [...b.tailPrimes];
  if (lengthB < BigInt(W)) for (const t of a.tailPrimes) if (Number(lengthB) + t < W) tailPrimes.push(Number(lengthB) + t);

  return {
    from: a.from,
    to: b.to,
    primeCount: a.primeCount + b.primeCount,
    firstPrime: a.firstPrime ?? b.firstPrime,
    lastPrime: b.lastPrime ?? a.lastPrime,
    gaps: a.gaps && b.gaps ? combineGaps(a.gaps, b.gaps, a.lastPrime, b.firstPrime) : null,
    patterns,
    window: W,
    headPrimes,
    tailPrimes,
  };
}

/**
 * Combines the summaries of consecutive adjacent ranges, in order.
 * @throws EngineError(input) for an empty list or any error of {@link combinePrimeBlocks}.
 */
export function combinePrimeBlockList(blocks: readonly PrimeBlock[]): PrimeBlock {
  if (blocks.length === 0) throw inputError('no prime blocks to combine');
  let acc = blocks[0]!;
  for (let i = 1; i < blocks.length; i++) acc = combinePrimeBlocks(acc, blocks[i]!);
  return acc;
}

function straddle(
  pa: PatternStatistics,
  pb: PatternStatistics,
  tail: readonly number[],
  near: Set<number>,
  lengthB: bigint,
  origin: bigint,
): PatternStatistics {
  const D = pa.pattern[pa.pattern.length - 1]!;
  let count = 0;
  let first: bigint | null = null;
  let last: bigint | null = null;
  // Candidates n = origin − t: n ≤ a.to < n + D ≤ b.to; tail is p-decreasing, so walk it backwards.
  for (let i = tail.length - 1; i >= 0; i--) {
    const t = tail[i]!;
    if (t >= D || BigInt(D - t) > lengthB) continue;
    if (pa.pattern.every((h) => near.has(h - t))) {
      count++;
      const n = origin - BigInt(t);
      if (first === null) first = n;
      last = n;
    }
  }
  return {
    pattern: pa.pattern,
    count: pa.count + count + pb.count,
    first: pa.first ?? first ?? pb.first,
    last: pb.last ?? last ?? pa.last,
  };
}

function combineGaps(a: GapStatistics, b: GapStatistics, lastA: bigint | null, firstB: bigint | null): GapStatistics {
  const histogram = new Map(a.histogram);
  const records: GapRecord[] = [...a.records];
  let max = records.length > 0 ? records[records.length - 1]!.gap : 0;
  if (lastA !== null && firstB !== null) {
    const g = Number(firstB - lastA);
    histogram.set(g, (histogram.get(g) ?? 0) + 1);
    if (g > max) {
      records.push({ gap: g, after: lastA });
      max = g;
    }
  }
  for (const [g, c] of b.histogram) histogram.set(g, (histogram.get(g) ?? 0) + c);
  for (const r of b.records) {
    if (r.gap > max) {
      records.push(r);
      max = r.gap;
    }
  }
  return { histogram: new Map([...histogram].sort((x, y) => x[0] - y[0])), records };
}
