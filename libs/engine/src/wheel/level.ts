import { inputError, limitError } from '../errors';
import { checkStop, type WorkHooks } from '../sieve/progress';
import { combineWheelChunks, planWheelChunks, runWheelChunk, type WheelChunkTally } from './chunk';
import { MAX_MEMORY_LEVEL, wheelGaps } from './level-gaps';
import { checkLevel, previousPrime, primorial, primorialTotient } from './primorial';
import { nextPairTally } from './pair-recursion';
import { nextHistogram } from './recursion';
import { cycleHistogramAndPairSums, scanGapCycle } from './scan';
import { histogramFromDense, histogramMaxGap, pairSums, patternsFromDense, type GapHistogram, type PatternTally } from './tally';

/** Summary of a wheel level: modulus p#, φ(p#) members, the largest gap (Jacobsthal value) and the histogram. */
export interface WheelLevelSummary {
  readonly prime: number;
  readonly modulus: bigint;
  readonly members: bigint;
  readonly maxGap: number;
  readonly histogram: GapHistogram;
}

/** Full statistics of an enumerated level: summary plus first positions and pattern tallies. */
export interface WheelLevelStats extends WheelLevelSummary {
  /** gap → least member m in [1, p#] whose next member is m + gap. */
  readonly firstPosition: ReadonlyMap<number, number>;
  /** length (2 … 4) → tally of consecutive gap patterns over one period. */
  readonly patterns: ReadonlyMap<number, PatternTally>;
}

/** Default bound on base-cycle steps a synchronous call may stream (about 2–5 s). */
export const DEFAULT_STREAM_STEPS = 2e9;

/**
 * Streams level `target` over the in-memory level 23 (or the previous level when target ≤ 23) in one
 * thread and returns the combined tallies (first positions only when asked: they cost a second pass).
 * `hooks` get the fraction of the 64 chunks done after each chunk (tens of milliseconds each for
 * 29#) and are polled for a stop before each.
 * @throws EngineError(limit) when the walk would exceed `maxSteps` base steps, or when
 *   `hooks.shouldStop` answers true.
 */
export function streamLevel(
  target: number, patternLength: 1 | 2 | 3 | 4, maxSteps = DEFAULT_STREAM_STEPS, radix?: number, firstPositions = false,
  hooks?: WorkHooks,
): WheelChunkTally {
  checkLevel(target, 41);
  const base = Math.min(previousPrime(target), MAX_MEMORY_LEVEL);
  const gaps = wheelGaps(base);
  const specs = planWheelChunks(base, target, 64, patternLength, radix, firstPositions);
  const copies = specs[specs.length - 1]!.copyTo;
  if (copies * gaps.length > maxSteps) {
    throw limitError(`streaming level ${target} takes ${copies * gaps.length} steps, above the limit ${maxSteps} (use the parallel driver)`);
  }
  const what = `streaming level ${target}`;
  const parts = specs.map((s, i) => {
    checkStop(hooks, what);
    const t = runWheelChunk(s, gaps);
    hooks?.onProgress?.((i + 1) / specs.length, what);
    return t;
  });
  return combineWheelChunks(parts);
}

/** Sums the dense length-L tally over its last gap, giving the length-(L−1) tally (full periods only). */
function shorterPatterns(t: WheelChunkTally): Map<number, PatternTally> {
  const out = new Map<number, PatternTally>();
  if (!t.patterns) return out;
  const R = t.radix + 1;
  let dense = t.patterns;
  for (let L = t.patternLength; L >= 2; L--) {
    out.set(L, patternsFromDense(dense, L, R, t.radix));
    const next = new Float64Array(dense.length / R);
    for (let i = 0; i < next.length; i++) {
      let s = 0;
      for (let h = 0; h < R; h++) s += dense[i * R + h]!;
      next[i] = s;
    }
    dense = next;
  }
  return out;
}

/**
 * Tally of consecutive gap quadruples of level P over one period: scanned for P ≤ 23, streamed over
 * 23# beyond (29#: about 10^9 steps).
 * @throws EngineError(limit) when streaming would exceed `maxSteps`.
 */
export function levelQuadTally(P: number, maxSteps = DEFAULT_STREAM_STEPS, hooks?: WorkHooks): PatternTally {
  if (P <= MAX_MEMORY_LEVEL) return scanGapCycle(wheelGaps(P), [4]).patterns.get(4)!;
  const t = streamLevel(P, 4, maxSteps, histogramMaxGap(gapHistogram(P, maxSteps)) / 2 + 1, false, hooks);
  return patternsFromDense(t.patterns!, 4, t.radix + 1, t.radix);
}

/**
 * Ordered tally of consecutive gap pairs of level P: scanned for P ≤ 23; deeper by
 * {@link nextPairTally} from the previous level's quadruples (scanned or streamed), or by streaming
 * P itself when that recursion's condition fails.
 * @throws EngineError(limit) when streaming would exceed `maxSteps`.
 */
export function levelPairTally(P: number, maxSteps = DEFAULT_STREAM_STEPS, hooks?: WorkHooks): PatternTally {
  checkLevel(P, 41);
  if (P <= MAX_MEMORY_LEVEL) return scanGapCycle(wheelGaps(P), [2]).patterns.get(2)!;
  const Pp = previousPrime(P);
  const quads = levelQuadTally(Pp, maxSteps, hooks);
  let maxPrev = 0;
  for (const key of quads.keys()) for (const g of key.split(',')) maxPrev = Math.max(maxPrev, Number(g));
  if (maxPrev < 2 * P) return nextPairTally(quads, P);
  const t = streamLevel(P, 2, maxSteps, undefined, false, hooks);
  return patternsFromDense(t.patterns!, 2, t.radix + 1, t.radix);
}

/**
 * Consecutive pair sums T2_P(g) of level P (see {@link levelPairTally}; a fast dense scan for P ≤ 23).
 * @throws EngineError(limit) when streaming would exceed `maxSteps`.
 */
export function levelPairSums(P: number, maxSteps = DEFAULT_STREAM_STEPS, hooks?: WorkHooks): GapHistogram {
  if (P <= MAX_MEMORY_LEVEL) return cycleHistogramAndPairSums(wheelGaps(P)).pairSums;
  return pairSums(levelPairTally(P, maxSteps, hooks));
}

/**
 * Gap histogram of wheel level p (one period). Levels ≤ 23 by enumeration; deeper levels by the
 * recursion {@link nextHistogram} with the previous level's pair sums ({@link levelPairSums}), or
 * by streaming level p itself when the recursion's condition fails. 29# takes one scan of 23#;
 * 31# a scan of the quadruples of 23#; 37# streams the quadruples of 29# (about 10^9 steps; the
 * parallel driver in `@cribra/engine/node` shares them between worker threads). `hooks` report the
 * progress of a streamed level (see {@link streamLevel}); the in-memory scans and the recursion
 * report nothing.
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when the work would exceed
 *   `maxSteps` streamed steps (default {@link DEFAULT_STREAM_STEPS}) or `hooks.shouldStop` answers true.
 */
export function gapHistogram(p: number, maxSteps = DEFAULT_STREAM_STEPS, hooks?: WorkHooks): GapHistogram {
  checkLevel(p, 41);
  if (p <= MAX_MEMORY_LEVEL) return cycleHistogramAndPairSums(wheelGaps(p)).histogram;
  const P = previousPrime(p);
  if (P <= MAX_MEMORY_LEVEL) {
    // one pass over the in-memory cycle gives both inputs of the recursion
    const scan = cycleHistogramAndPairSums(wheelGaps(P));
    if (histogramMaxGap(scan.histogram) < 2 * p) return nextHistogram(scan.histogram, scan.pairSums, p);
    return histogramFromDense(streamLevel(p, 1, maxSteps, undefined, false, hooks).histogram);
  }
  const prev = gapHistogram(P, maxSteps, hooks);
  if (histogramMaxGap(prev) < 2 * p) return nextHistogram(prev, levelPairSums(P, maxSteps, hooks), p);
  return histogramFromDense(streamLevel(p, 1, maxSteps, undefined, false, hooks).histogram);
}

/**
 * Summary of wheel level p: modulus, number of members, largest gap, histogram (see {@link gapHistogram}).
 * @throws EngineError as {@link gapHistogram}.
 */
export function wheelLevel(p: number, maxSteps = DEFAULT_STREAM_STEPS): WheelLevelSummary {
  const histogram = gapHistogram(p, maxSteps);
  return { prime: p, modulus: primorial(p), members: primorialTotient(p), maxGap: histogramMaxGap(histogram), histogram };
}

/**
 * Full statistics of level p ≤ 29: histogram, largest gap, first position of each gap and tallies of
 * consecutive gap patterns of the given lengths (2 … 4). Levels ≤ 23 are scanned in memory; 29# is
 * streamed from 23# (about 10^9 steps, several seconds; `hooks` report its progress per chunk and may
 * stop it, see {@link streamLevel}).
 * @throws EngineError(input) when p is not a prime or a length is not in 2 … 4; EngineError(limit) when
 *   p > 29 or `hooks.shouldStop` answers true.
 */
export function wheelLevelStats(p: number, patternLengths: readonly number[] = [2, 3, 4], hooks?: WorkHooks): WheelLevelStats {
  checkLevel(p, 29);
  if (p <= MAX_MEMORY_LEVEL) {
    const s = scanGapCycle(wheelGaps(p), patternLengths);
    return { prime: p, modulus: primorial(p), members: primorialTotient(p), ...s };
  }
  const L = Math.max(1, ...checkLengths(patternLengths)) as 1 | 2 | 3 | 4;
  return levelStatsFromTally(p, streamLevel(p, L, 4e9, undefined, true, hooks), patternLengths);
}

function checkLengths(lengths: readonly number[]): readonly number[] {
  for (const L of lengths) if (!(L >= 2 && L <= 4 && Number.isInteger(L))) throw inputError(`pattern length ${L} is not in 2 … 4`);
  return lengths;
}

/**
 * Level statistics from the combined tallies of a whole period (all chunks of a streamed level,
 * streamed with first positions and patterns of the longest requested length).
 * @throws EngineError(input) for a length outside 2 … 4 or longer than the tally's patterns.
 */
export function levelStatsFromTally(p: number, t: WheelChunkTally, patternLengths: readonly number[]): WheelLevelStats {
  checkLengths(patternLengths);
  const all = shorterPatterns(t);
  const patterns = new Map<number, PatternTally>();
  for (const len of patternLengths) {
    const tally = all.get(len);
    if (!tally) throw inputError(`the tally holds patterns of length ${t.patternLength}, not ${len}`);
    patterns.set(len, tally);
  }
  const firstPosition = new Map<number, number>();
  for (let h = 0; h < t.radix; h++) if (t.firstPosition[h]! >= 0) firstPosition.set(2 * h, t.firstPosition[h]!);
  const histogram = histogramFromDense(t.histogram);
  return { prime: p, modulus: primorial(p), members: primorialTotient(p), maxGap: t.maxGap, histogram, firstPosition, patterns };
}
