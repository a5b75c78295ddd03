import { availableParallelism } from 'node:os';
import { inputError } from '../errors';
import { nodeWorkerFile, runChunksOnWorkers } from './chunk-workers';
import { combineWheelChunks, planWheelChunks, type WheelChunkSpec, type WheelChunkTally } from '../wheel/chunk';
import { MAX_MEMORY_LEVEL } from '../wheel/level-gaps';
import { gapHistogram, levelQuadTally, levelStatsFromTally, wheelLevelStats, type WheelLevelStats } from '../wheel/level';
import { nextPairTally } from '../wheel/pair-recursion';
import { checkLevel, previousPrime } from '../wheel/primorial';
import { nextHistogram } from '../wheel/recursion';
import { histogramMaxGap, pairSums, patternsFromDense, type GapHistogram, type PatternTally } from '../wheel/tally';

/** Options of the parallel wheel drivers. */
export interface WheelPoolOptions {
  /** worker threads (default: all cores) */
  readonly workers?: number;
  /** chunks per worker (default 8; more chunks balance better, each costs one message) */
  readonly chunksPerWorker?: number;
  /** called after each finished chunk */
  readonly onProgress?: (done: number, total: number) => void;
}

/**
 * Runs chunk specs (all over the same base level) on worker threads sharing the base gap cycle,
 * and combines the partial tallies. Any worker error rejects with an EngineError naming the chunk.
 * @throws EngineError(input) for an empty or mixed list of specs.
 */
export async function runWheelChunksParallel(specs: readonly WheelChunkSpec[], options: WheelPoolOptions = {}): Promise<WheelChunkTally> {
  if (specs.length === 0) throw inputError('no chunks to run');
  const base = specs[0]!.base;
  if (specs.some((s) => s.base !== base)) throw inputError('all chunks of one run must share the base level');
  const parts = await runChunksOnWorkers<WheelChunkSpec, WheelChunkTally>({
    file: nodeWorkerFile('wheel-worker.js'), base, specs, workers: options.workers ?? availableParallelism(), key: 'tally',
    describe: (s) => `chunk ${s.target}# copies [${s.copyFrom}, ${s.copyTo})`, onProgress: options.onProgress,
  });
  return combineWheelChunks(parts);
}

/**
 * Streams level `target` (≤ 41) over the in-memory level 23 on worker threads (see {@link planWheelChunks}).
 * @throws EngineError(input) for bad levels.
 */
export async function streamLevelParallel(
  target: number,
  patternLength: 1 | 2 | 3 | 4,
  options: WheelPoolOptions & { radix?: number; firstPositions?: boolean } = {},
): Promise<WheelChunkTally> {
  checkLevel(target, 41);
  const base = Math.min(previousPrime(target), MAX_MEMORY_LEVEL);
  const workers = options.workers ?? availableParallelism();
  const specs = planWheelChunks(base, target, workers * (options.chunksPerWorker ?? 8), patternLength, options.radix, options.firstPositions ?? false);
  return runWheelChunksParallel(specs, options);
}

/**
 * Tally of consecutive gap quadruples of level P over one period, streamed on worker threads for
 * P > 23 (scanned in memory otherwise). The tally radix is taken from P's histogram (largest gap).
 */
export async function levelQuadTallyParallel(P: number, options: WheelPoolOptions = {}): Promise<PatternTally> {
  if (P <= MAX_MEMORY_LEVEL) return levelQuadTally(P);
  const radix = histogramMaxGap(gapHistogram(P)) / 2 + 1;
  const t = await streamLevelParallel(P, 4, { ...options, radix });
  return patternsFromDense(t.patterns!, 4, t.radix + 1, t.radix);
}

/**
 * Gap histogram of wheel level p ≤ 41 with the streaming shared between worker threads: levels ≤ 31
 * as {@link gapHistogram} (no streaming needed); deeper ones by hist_p = (p−2)·hist_P + T2_P with the
 * pair sums T2_P from {@link nextPairTally} over the quadruples of the level before P, streamed in
 * parallel (37#: quadruples of 29#, about 10^9 steps).
 * @throws EngineError(input) when p is not a prime; EngineError(limit) when p > 41;
 *   EngineError(domain) when a recursion condition fails.
 */
export async function gapHistogramParallel(p: number, options: WheelPoolOptions = {}): Promise<GapHistogram> {
  checkLevel(p, 41);
  if (p <= 31) return gapHistogram(p);
  const P = previousPrime(p);
  const prev = await gapHistogramParallel(P, options);
  const quads = await levelQuadTallyParallel(previousPrime(P), options);
  return nextHistogram(prev, pairSums(nextPairTally(quads, P)), p);
}

/**
 * Full statistics of level p ≤ 29 (as {@link wheelLevelStats}) with the 29# stream shared between
 * worker threads: histogram, largest gap, first positions and pattern tallies of lengths 2 … 4.
 * @throws EngineError(input) for a bad level or length; EngineError(limit) when p > 29.
 */
export async function wheelLevelStatsParallel(p: number, patternLengths: readonly number[] = [2, 3, 4], options: WheelPoolOptions = {}): Promise<WheelLevelStats> {
  checkLevel(p, 29);
  if (p <= MAX_MEMORY_LEVEL) return wheelLevelStats(p, patternLengths);
  for (const L of patternLengths) if (!(L >= 2 && L <= 4 && Number.isInteger(L))) throw inputError(`pattern length ${L} is not in 2 … 4`);
  const L = Math.max(1, ...patternLengths) as 1 | 2 | 3 | 4;
  const radix = histogramMaxGap(gapHistogram(p)) / 2 + 1;
  const t = await streamLevelParallel(p, L, { ...options, radix, firstPositions: true });
  return levelStatsFromTally(p, t, patternLengths);
}
