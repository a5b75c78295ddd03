import { createHash } from 'node:crypto';
import {
  chunkCopies,
  combineSplitChunks,
  checkedHistogram,
  combineWheelChunks,
  defaultSplitBase,
  histogramFromDense,
  histogramMaxGap,
  levelFromQuadTally,
  levelQuadTallyChunk,
  MAX_MEMORY_LEVEL,
  patternsFromDense,
  planWheelChunks,
  previousPrime,
  primorial,
  primorialTotient,
  planSplitChunks,
  quadTallyRadix,
  runSplitChunk,
  runWheelChunk,
  splitChunkResultFromJson,
  splitChunkResultToJson,
  splitHistogramsFromResult,
  SPLIT_MAX_LEVEL,
  wheelChunkTallyFromJson,
  wheelChunkTallyToJson,
  wheelGaps,
  wheelLevelStats,
  type GapHistogram,
  type PatternTally as EnginePatternTally,
  type SplitChunkResultJson,
  type WheelChunkTally,
  type WheelChunkTallyJson,
} from '@cribra/engine';
import type { GapCount, PatternTally } from '@cribra/contracts';

/** Levels up to 23# are enumerated in one piece by default; deeper ones are streamed in chunks. */
export const IN_ONE_PIECE_UP_TO = MAX_MEMORY_LEVEL;
/** Consecutive-pattern lengths stored for levels enumerated in one piece. */
export const SMALL_LEVEL_PATTERN_LENGTHS = [2, 3] as const;
/** Streamed levels store pairs of consecutive gaps. */
export const STREAMED_PATTERN_LENGTH = 2;
/** Base-cycle steps per chunk job by default (a few seconds of one core). */
export const STEPS_PER_CHUNK = 1e9;
/** Chunked levels from this prime on take the recursion route by default (29#, 31#, 37#: they keep pair tallies). */
export const RECURSION_FROM = 29;
/** Levels from this prime on take the split route by default (41# … 47#: histograms only). */
export const SPLIT_FROM = 41;
/** Chunk jobs of a split-route level by default (47#: about 0.15 s of one core each, as measured). */
export const SPLIT_CHUNKS = 32;

/**
 * How a level is split: in one piece (base null); streamed over `base` in `chunks` chunks; or, with
 * `quadsOf`, by the recursion route — the chunks tally the gap quadruples of level `quadsOf` (the
 * level before, streamed over `base`, half-gap radix `radix`) and the combine step derives the level.
 */
export interface LevelPlan {
  base: number | null;
  chunks: number;
  quadsOf?: number;
  radix?: number;
  /** split route: chunk i is group i of `chunks` groups of the members of level `base` */
  split?: boolean;
}

function chunkCount(base: number, target: number, stepsPerChunk: number): number {
  const copies = chunkCopies(base, target);
  const steps = copies * Number(primorialTotient(base));
  return Math.max(1, Math.min(copies, Math.ceil(steps / stepsPerChunk)));
}

/**
 * Plans a level. `onePieceUpTo` (≤ 23), `stepsPerChunk` and `recursionFrom` only change how the work
 * is cut and which exact route is taken, never the result (chunks partition the period; see the
 * engine's planWheelChunks and levelFromQuadTally). The recursion route applies when the largest gap
 * of the level before is below 2p (true for every level up to 41#; checked here all the same).
 * 31# then costs one stream of 29#'s quadruples (about 10^9 steps) instead of 3·10^10, 37# one
 * stream of 31#'s quadruples (3·10^10) instead of 10^12.
 */
export function planLevel(
  prime: number, onePieceUpTo = IN_ONE_PIECE_UP_TO, stepsPerChunk = STEPS_PER_CHUNK, recursionFrom = RECURSION_FROM,
  splitFrom = SPLIT_FROM, splitChunks = SPLIT_CHUNKS,
): LevelPlan {
  // The split route from `splitFrom` on (at least 7: its base is the level two primes below, ≥ 3);
  // beyond 41 it is the only route (the others would stream 10^12 members or more).
  if ((prime >= Math.max(splitFrom, 7) || prime > 41) && prime <= SPLIT_MAX_LEVEL) {
    const base = defaultSplitBase(prime);
    return { base, chunks: planSplitChunks(base, [prime], splitChunks).length, split: true };
  }
  if (prime <= Math.min(onePieceUpTo, IN_ONE_PIECE_UP_TO) || prime < 5) return { base: null, chunks: 1 };
  if (prime >= Math.max(recursionFrom, 7)) {
    const q = previousPrime(prime);
    const radix = quadTallyRadix(q); // maxGap(q)/2 + 1
    if (2 * (radix - 1) < 2 * prime) {
      const base = Math.min(previousPrime(q), IN_ONE_PIECE_UP_TO);
      return { base, chunks: chunkCount(base, q, stepsPerChunk), quadsOf: q, radix };
    }
  }
  const base = Math.min(previousPrime(prime), onePieceUpTo, IN_ONE_PIECE_UP_TO);
  return { base, chunks: chunkCount(base, prime, stepsPerChunk) };
}

/** A level chunk as stored in level_chunks.summary (JSON). */
export type ChunkSummaryJson =
  | { kind: 'stats'; prime: number; histogram: GapCount[]; largestGap: number; patternTallies: PatternTally[] }
  /** Recursion route: the quadruple tally of the level before over this chunk. */
  | { kind: 'quads'; prime: number; quadsOf: number; tally: WheelChunkTallyJson }
  /** Split route: partial counts of every gap of the level over one group of base members. */
  | { kind: 'split'; prime: number; result: SplitChunkResultJson }
  | {
      kind: 'tally';
      target: number;
      radix: number;
      patternLength: number;
      maxGap: number;
      steps: number;
      /** Sparse [index, count] pairs of the dense arrays. */
      histogram: Array<[number, number]>;
      patterns: Array<[number, number]> | null;
      firstPosition: Array<[number, number]>;
      histogramLength: number;
      patternsLength: number;
    };

const sparse = (a: Float64Array): Array<[number, number]> => {
  const out: Array<[number, number]> = [];
  a.forEach((v, i) => {
    if (v) out.push([i, v]);
  });
  return out;
};
const dense = (pairs: Array<[number, number]>, length: number, fill = 0): Float64Array => {
  const a = new Float64Array(length).fill(fill);
  for (const [i, v] of pairs) a[i] = v;
  return a;
};

function histogramList(h: GapHistogram): GapCount[] {
  return [...h].map(([gap, count]) => ({ gap, count: count.toString() }));
}
function tallyList(length: number, t: EnginePatternTally): PatternTally {
  return { length, entries: [...t].map(([key, count]) => ({ pattern: key.split(',').map(Number), count: count.toString() })) };
}

/** Computes chunk `index` of a level planned as `plan` with the engine. */
export function computeLevelChunk(prime: number, index: number, plan: LevelPlan): ChunkSummaryJson {
  if (plan.split) {
    const specs = planSplitChunks(plan.base!, [prime], plan.chunks);
    const spec = specs[index];
    if (!spec || specs.length !== plan.chunks) throw new Error(`level ${prime} has no split chunk ${index} of ${plan.chunks}`);
    return { kind: 'split', prime, result: splitChunkResultToJson(runSplitChunk(spec, wheelGaps(spec.base))) };
  }
  if (plan.quadsOf !== undefined) {
    const t = levelQuadTallyChunk(plan.quadsOf, index, plan.chunks, plan.radix);
    return { kind: 'quads', prime, quadsOf: plan.quadsOf, tally: wheelChunkTallyToJson(t) };
  }
  if (plan.base === null) {
    const s = wheelLevelStats(prime, [...SMALL_LEVEL_PATTERN_LENGTHS]);
    return {
      kind: 'stats',
      prime,
      histogram: histogramList(s.histogram),
      largestGap: s.maxGap,
      patternTallies: SMALL_LEVEL_PATTERN_LENGTHS.map((L) => tallyList(L, s.patterns.get(L)!)),
    };
  }
  const spec = planWheelChunks(plan.base, prime, plan.chunks, STREAMED_PATTERN_LENGTH)[index];
  if (!spec) throw new Error(`level ${prime} has no chunk ${index} of ${plan.chunks}`);
  const t = runWheelChunk(spec, wheelGaps(spec.base));
  return {
    kind: 'tally',
    target: t.target,
    radix: t.radix,
    patternLength: t.patternLength,
    maxGap: t.maxGap,
    steps: t.steps,
    histogram: sparse(t.histogram),
    patterns: t.patterns ? sparse(t.patterns) : null,
    firstPosition: sparse(t.firstPosition.map((v) => v + 1)),
    histogramLength: t.histogram.length,
    patternsLength: t.patterns?.length ?? 0,
  };
}

function tallyFromJson(j: Extract<ChunkSummaryJson, { kind: 'tally' }>): WheelChunkTally {
  const firstPosition = dense(j.firstPosition, j.histogramLength, 0).map((v) => v - 1);
  return {
    target: j.target,
    radix: j.radix,
    patternLength: j.patternLength,
    histogram: dense(j.histogram, j.histogramLength),
    patterns: j.patterns ? dense(j.patterns, j.patternsLength) : null,
    firstPosition,
    maxGap: j.maxGap,
    steps: j.steps,
  };
}

export interface LevelResult {
  prime: number;
  modulus: string;
  phi: string;
  largestGap: number;
  histogram: GapCount[];
  patternTallies: PatternTally[];
  digest: string;
}

/** Combines the chunks of a level (in chunk order) into the stored result, with its digest. */
export function combineLevelChunks(prime: number, chunks: ChunkSummaryJson[]): LevelResult {
  let body: Omit<LevelResult, 'digest'>;
  const head = { prime, modulus: primorial(prime).toString(), phi: primorialTotient(prime).toString() };
  if (chunks.length === 1 && chunks[0].kind === 'stats') {
    const s = chunks[0];
    body = { ...head, largestGap: s.largestGap, histogram: s.histogram, patternTallies: s.patternTallies };
  } else if (chunks[0]?.kind === 'split') {
    // Σ n_g = φ(p#) and Σ g·n_g = p# are checked here, before anything is stored
    const parts = chunks.map((c) => {
      if (c.kind !== 'split' || c.prime !== prime) throw new Error('mixed chunk kinds');
      return splitChunkResultFromJson(c.result);
    });
    const histogram = splitHistogramsFromResult(combineSplitChunks(parts)).get(prime)!;
    body = { ...head, largestGap: histogramMaxGap(histogram), histogram: histogramList(histogram), patternTallies: [] };
  } else if (chunks[0]?.kind === 'quads') {
    // Add the partial quadruple tallies one at a time (each is a dense array of (radix+1)^4 counts).
    let quads: WheelChunkTally | null = null;
    for (const c of chunks) {
      if (c.kind !== 'quads' || c.prime !== prime) throw new Error('mixed chunk kinds');
      const part = wheelChunkTallyFromJson(c.tally);
      quads = quads ? combineWheelChunks([quads, part]) : part;
    }
    const level = levelFromQuadTally(prime, quads!);
    body = { ...head, largestGap: level.maxGap, histogram: histogramList(level.histogram), patternTallies: [tallyList(STREAMED_PATTERN_LENGTH, level.pairs)] };
  } else {
    const t = combineWheelChunks(chunks.map((c) => {
      if (c.kind !== 'tally') throw new Error('mixed chunk kinds');
      return tallyFromJson(c);
    }));
    const R = t.radix + 1;
    body = {
      ...head,
      largestGap: t.maxGap,
      histogram: histogramList(histogramFromDense(t.histogram, t.radix)),
      patternTallies: t.patterns ? [tallyList(t.patternLength, patternsFromDense(t.patterns, t.patternLength, R, t.radix))] : [],
    };
  }
  // whatever the route: Σ n_g = φ(p#) and Σ g·n_g = p# before the level is stored
  checkedHistogram(prime, new Map(body.histogram.map((e) => [e.gap, BigInt(e.count)])));
  const digest = createHash('sha256').update(JSON.stringify(body)).digest('hex');
  return { ...body, digest };
}
