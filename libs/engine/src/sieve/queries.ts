import { inputError } from '../errors';
import type { GapStatistics, PatternStatistics } from './prime-block';
import type { WorkHooks } from './progress';
import { parseSieveRange, sievePrimeBlock, type RangeEnd } from './range';

/**
 * π(to) − π(from − 1): the number of primes p with from ≤ p ≤ to. `hooks`: progress and stop check
 * as in {@link sievePrimeBlock}.
 * @throws EngineError as {@link sievePrimeBlock}.
 */
export function countPrimes(from: RangeEnd, to: RangeEnd, hooks: WorkHooks = {}): number {
  return sievePrimeBlock(from, to, hooks).primeCount;
}

/**
 * Occurrences of the constellation pattern H in [from, to]: the n with n + h prime for every h ∈ H,
 * n ≥ from and n + max H ≤ to (H normalized to start at 0), with the first and last such n.
 * Example: pattern [0, 2] over [0, 10^k] counts the twin pairs (p, p + 2) with p + 2 ≤ 10^k.
 * `hooks`: progress and stop check as in {@link sievePrimeBlock}.
 * @throws EngineError as {@link sievePrimeBlock}.
 */
export function countConstellation(
  pattern: ReadonlyArray<number | bigint | string>,
  from: RangeEnd,
  to: RangeEnd,
  hooks: WorkHooks = {},
): PatternStatistics {
  return sievePrimeBlock(from, to, { patterns: [pattern], onProgress: hooks.onProgress, shouldStop: hooks.shouldStop }).patterns[0]!;
}

/**
 * Gaps between consecutive primes of [from, to]: the histogram and the record gaps (each larger than
 * all earlier ones in the range; from 2 on these are the maximal prime gaps). `hooks`: progress and
 * stop check as in {@link sievePrimeBlock}.
 * @throws EngineError as {@link sievePrimeBlock}.
 */
export function primeGapStatistics(from: RangeEnd, to: RangeEnd, hooks: WorkHooks = {}): GapStatistics {
  return sievePrimeBlock(from, to, { gaps: true, onProgress: hooks.onProgress, shouldStop: hooks.shouldStop }).gaps!;
}

/**
 * Splits [from, to] into `parts` adjacent ranges of nearly equal length (each end a multiple of 30
 * where possible, so that segments align with the wheel), for parallel or distributed sieving.
 * @throws EngineError(input) when parts is not a positive integer, or as {@link parseSieveRange}.
 */
export function splitSieveRange(from: RangeEnd, to: RangeEnd, parts: number): Array<{ from: bigint; to: bigint }> {
  if (!Number.isSafeInteger(parts) || parts < 1) throw inputError(`number of parts ${parts} is not a positive integer`);
  const r = parseSieveRange(from, to);
  const length = r.to - r.from + 1n;
  const out: Array<{ from: bigint; to: bigint }> = [];
  let start = r.from;
  for (let i = 1; i <= parts && start <= r.to; i++) {
    let end = i === parts ? r.to : r.from + (length * BigInt(i)) / BigInt(parts) - 1n;
    if (i < parts) end = end - ((end + 1n) % 30n);
    if (end < start) continue;
    if (end > r.to) end = r.to;
    out.push({ from: start, to: end });
    start = end + 1n;
  }
  return out;
}
