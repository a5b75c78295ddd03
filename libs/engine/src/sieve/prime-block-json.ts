import { inputError } from '../errors';
import type { PrimeBlock, PrimeBlockJson } from './prime-block';

const str = (v: bigint | null): string | null => (v === null ? null : v.toString());

/** The JSON form of a block (decimal strings for bigints), for storage and for messages between processes. */
export function primeBlockToJson(block: PrimeBlock): PrimeBlockJson {
  return {
    version: 1,
    from: block.from.toString(),
    to: block.to.toString(),
    primeCount: block.primeCount,
    firstPrime: str(block.firstPrime),
    lastPrime: str(block.lastPrime),
    gaps: block.gaps && {
      histogram: Object.fromEntries([...block.gaps.histogram].map(([g, c]) => [String(g), c])),
      records: block.gaps.records.map((r) => ({ gap: r.gap, after: r.after.toString() })),
    },
    patterns: block.patterns.map((p) => ({
      pattern: [...p.pattern],
      count: p.count,
      first: str(p.first),
      last: str(p.last),
    })),
    window: block.window,
    headPrimes: [...block.headPrimes],
    tailPrimes: [...block.tailPrimes],
  };
}

/**
 * Reads a block back from its JSON form.
 * @throws EngineError(input) when the object is not a version-1 prime block.
 */
export function primeBlockFromJson(json: PrimeBlockJson): PrimeBlock {
  if (!json || json.version !== 1 || typeof json.from !== 'string' || typeof json.to !== 'string') {
    throw inputError('not a version-1 prime block summary');
  }
  const big = (v: string | null): bigint | null => (v === null ? null : BigInt(v));
  return {
    from: BigInt(json.from),
    to: BigInt(json.to),
    primeCount: json.primeCount,
    firstPrime: big(json.firstPrime),
    lastPrime: big(json.lastPrime),
    gaps: json.gaps && {
      histogram: new Map(
        Object.entries(json.gaps.histogram)
          .map(([g, c]) => [Number(g), c] as [number, number])
          .sort((x, y) => x[0] - y[0]),
      ),
      records: json.gaps.records.map((r) => ({ gap: r.gap, after: BigInt(r.after) })),
    },
    patterns: json.patterns.map((p) => ({ pattern: [...p.pattern], count: p.count, first: big(p.first), last: big(p.last) })),
    window: json.window,
    headPrimes: [...json.headPrimes],
    tailPrimes: [...json.tailPrimes],
  };
}
