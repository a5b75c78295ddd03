import { domainError, inputError } from '../errors';
import { planWheelChunks, runWheelChunk, type WheelChunkSpec, type WheelChunkTally } from './chunk';
import { gapHistogram } from './level';
import { MAX_MEMORY_LEVEL, wheelGaps } from './level-gaps';
import { checkLevel, previousPrime } from './primorial';
import { nextPairTally } from './pair-recursion';
import { histogramMaxGap, patternsFromDense, type GapHistogram, type PatternTally } from './tally';

/**
 * Half-gap radix that fits every gap of level q in a quadruple chunk tally: maxGap(q)/2 + 1.
 * Cheap for q ≤ 31 (a scan of 23# at most); 37 streams the quadruples of 29# (about 10^9 steps).
 * @throws EngineError(input) when q is not a prime ≥ 3 or above 37.
 */
export function quadTallyRadix(q: number): number {
  checkLevel(q, 37);
  if (q < 3) throw inputError(`quadruple tallies need a level ≥ 3, got ${q}`);
  return histogramMaxGap(gapHistogram(q)) / 2 + 1;
}

/**
 * Splits the period of level q (3 ≤ q ≤ 37) into `count` chunks whose tallies of consecutive gap
 * quadruples add up to the quadruple tally of q (see {@link planWheelChunks}): q is streamed over
 * the previous level (over 23# when q > 29). Pure data; at most q#/base# chunks.
 * @param radix half-gap radix of the tallies; {@link quadTallyRadix}(q) when omitted.
 * @throws EngineError(input) for a bad level or count.
 */
export function planLevelQuadChunks(q: number, count: number, radix = quadTallyRadix(q)): WheelChunkSpec[] {
  checkLevel(q, 37);
  if (q < 3) throw inputError(`quadruple tallies need a level ≥ 3, got ${q}`);
  if (!(Number.isInteger(count) && count >= 1)) throw inputError(`chunk count ${count} must be a positive integer`);
  return planWheelChunks(Math.min(previousPrime(q), MAX_MEMORY_LEVEL), q, count, 4, radix);
}

/**
 * Tally of consecutive gap quadruples of level q over chunk `index` of {@link planLevelQuadChunks}
 * (q, count, radix). Pure and deterministic: the same arguments give the same tally on any machine;
 * the tallies of all chunks, added with combineWheelChunks, equal the one-piece quadruple tally.
 * @throws EngineError(input) when there is no such chunk; EngineError(limit) when a gap exceeds the radix.
 */
export function levelQuadTallyChunk(q: number, index: number, count: number, radix = quadTallyRadix(q)): WheelChunkTally {
  const specs = planLevelQuadChunks(q, count, radix);
  const spec = specs[index];
  if (!spec || !Number.isInteger(index)) throw inputError(`level ${q} has no quadruple chunk ${index} of ${specs.length}`);
  return runWheelChunk(spec, wheelGaps(spec.base));
}

/** Level statistics that follow from the previous level's quadruple tally. */
export interface LevelFromQuads {
  readonly prime: number;
  readonly histogram: GapHistogram;
  readonly maxGap: number;
  /** ordered tally of consecutive gap pairs of level p */
  readonly pairs: PatternTally;
}

/**
 * Histogram, largest gap and ordered pair tally of level p from the combined quadruple tally of
 * the previous level q (one full period): pairs by {@link nextPairTally}, the histogram as the sum
 * of the pair tally over its second gap (every gap starts exactly one pair in a period).
 * @param quads combined tally of all chunks of {@link planLevelQuadChunks}(q, …), q = previous prime of p
 * @throws EngineError(input) for a tally of another level or length; EngineError(domain) when
 *   maxGap(q) ≥ 2p (the recursion does not apply: stream level p instead).
 */
export function levelFromQuadTally(p: number, quads: WheelChunkTally): LevelFromQuads {
  checkLevel(p, 41);
  if (quads.patternLength !== 4 || !quads.patterns) throw inputError('levelFromQuadTally needs a tally of consecutive quadruples');
  if (quads.target !== previousPrime(p)) throw inputError(`level ${p} needs the quadruples of ${previousPrime(p)}#, got ${quads.target}#`);
  if (quads.maxGap >= 2 * p) throw domainError(`pair recursion to level ${p} needs maxGap(${quads.target}#) < ${2 * p}, but it is ${quads.maxGap}`);
  const pairs = nextPairTally(patternsFromDense(quads.patterns, 4, quads.radix + 1, quads.radix), p);
  const acc = new Map<number, bigint>();
  for (const [key, v] of pairs) {
    const a = Number(key.slice(0, key.indexOf(',')));
    acc.set(a, (acc.get(a) ?? 0n) + v);
  }
  const histogram: GapHistogram = new Map([...acc.entries()].filter(([, v]) => v !== 0n).sort((x, y) => x[0] - y[0]));
  return { prime: p, histogram, maxGap: histogramMaxGap(histogram), pairs };
}
