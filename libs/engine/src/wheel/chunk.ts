import { inputError, limitError } from '../errors';
import { isSmallPrime } from '../primes/small-primes';
import { MAX_MEMORY_LEVEL } from './level-gaps';
import { HALF_GAP_RADIX } from './tally';

/** Deepest level that can be streamed (positions must stay below 2^53). */
export const MAX_STREAM_LEVEL = 41;

/**
 * One independent piece of a streamed level. The target level's cycle is the base cycle (a level
 * ≤ 23 held in memory) replicated target#/base# times with the multiples of the primes in
 * (base, target] removed. A chunk covers the copies [copyFrom, copyTo) of the base cycle, i.e. the
 * positions [1 + copyFrom·base#, 1 + copyTo·base#), and tallies every gap (and every pattern of
 * consecutive gaps) whose FIRST member lies in that range — so chunks partition the cycle and
 * partial results combine by addition. Plain data: it can be sent to a worker or another machine.
 */
export interface WheelChunkSpec {
  readonly base: number;
  readonly target: number;
  readonly copyFrom: number;
  readonly copyTo: number;
  /** 1: histogram only; L = 2, 3, 4: also runs of L consecutive gaps (ordered). */
  readonly patternLength: 1 | 2 | 3 | 4;
  /** half-gap bound of the dense tallies (gaps ≤ 2·radix − 2); default {@link defaultChunkRadix}. */
  readonly radix?: number;
  /** also record the first position of each gap (a second pass over copies meeting a new gap); default false */
  readonly firstPositions?: boolean;
}

/**
 * Partial tallies of one or more chunks, dense over half-gaps h = g/2 < radix. `histogram[h]`
 * counts gaps; `patterns` (for patternLength L ≥ 2) counts runs of L consecutive gaps at index
 * Σ h_i·R^(L−1−i) with R = radix + 1 (digit `radix` is the "no previous gap" sentinel, never a real
 * count). Shorter patterns follow from a full period by summing over the last gap. Counts are exact
 * while below 2^53.
 */
export interface WheelChunkTally {
  readonly target: number;
  readonly radix: number;
  readonly patternLength: number;
  histogram: Float64Array;
  patterns: Float64Array | null;
  /** least first-member position of each gap in the covered range (−1: none). */
  firstPosition: Float64Array;
  maxGap: number;
  /** number of base gaps walked (for progress and speed figures). */
  steps: number;
}

/** Default half-gap radix of chunk tallies: 64 (gaps ≤ 126) for L ≤ 3, 32 (gaps ≤ 62) for L = 4. */
export function defaultChunkRadix(patternLength: number): number {
  return patternLength >= 4 ? 32 : HALF_GAP_RADIX;
}

/** Number of copies of the base cycle in one period of the target level: target#/base#. */
export function chunkCopies(base: number, target: number): number {
  let c = 1;
  for (let q = base + 1; q <= target; q++) if (isSmallPrime(q)) c *= q;
  return c;
}

/**
 * Splits the period of level `target` streamed over level `base` into `count` chunk specs of nearly
 * equal size (at most one per copy of the base cycle).
 * @throws EngineError(input) for levels that are not primes with base < target, base > 23 or target > 41.
 */
export function planWheelChunks(
  base: number, target: number, count: number, patternLength: 1 | 2 | 3 | 4 = 2, radix?: number, firstPositions = false,
): WheelChunkSpec[] {
  checkSpecLevels(base, target);
  const copies = chunkCopies(base, target);
  const n = Math.max(1, Math.min(copies, Math.floor(count)));
  const out: WheelChunkSpec[] = [];
  for (let i = 0; i < n; i++) {
    const copyFrom = Math.floor((i * copies) / n);
    const copyTo = Math.floor(((i + 1) * copies) / n);
    if (copyTo > copyFrom) out.push({ base, target, copyFrom, copyTo, patternLength, ...(radix === undefined ? {} : { radix }), ...(firstPositions ? { firstPositions } : {}) });
  }
  return out;
}

function checkSpecLevels(base: number, target: number): void {
  if (!isSmallPrime(base) || !isSmallPrime(target)) throw inputError(`levels ${base} and ${target} must be primes`);
  if (base > MAX_MEMORY_LEVEL) throw limitError(`base level ${base} is above ${MAX_MEMORY_LEVEL}`);
  if (target <= base) throw inputError(`target level ${target} must be above the base level ${base}`);
  if (target > MAX_STREAM_LEVEL) throw limitError(`streamed level ${target} is above ${MAX_STREAM_LEVEL}`);
}

/** Empty tallies for a target level. */
export function emptyChunkTally(target: number, patternLength: number, radix = defaultChunkRadix(patternLength)): WheelChunkTally {
  const R = radix + 1;
  return {
    target,
    radix,
    patternLength,
    histogram: new Float64Array(radix),
    patterns: patternLength >= 2 ? new Float64Array(R ** patternLength) : null,
    firstPosition: new Float64Array(radix).fill(-1),
    maxGap: 0,
    steps: 0,
  };
}

/**
 * Adds partial tallies (the combine step of the chunk API; order does not matter).
 * @throws EngineError(input) when the tallies belong to different levels, lengths or radices.
 */
export function combineWheelChunks(parts: readonly WheelChunkTally[]): WheelChunkTally {
  if (parts.length === 0) throw inputError('no chunk tallies to combine');
  const p0 = parts[0]!;
  const out = emptyChunkTally(p0.target, p0.patternLength, p0.radix);
  for (const t of parts) {
    if (t.target !== p0.target || t.patternLength !== p0.patternLength || t.radix !== p0.radix) {
      throw inputError(`cannot combine chunk tallies of level ${t.target} (L=${t.patternLength}) with level ${p0.target} (L=${p0.patternLength})`);
    }
    addInto(out.histogram, t.histogram);
    if (out.patterns && t.patterns) addInto(out.patterns, t.patterns);
    for (let h = 0; h < out.radix; h++) {
      const f = t.firstPosition[h]!;
      if (f >= 0 && (out.firstPosition[h]! < 0 || f < out.firstPosition[h]!)) out.firstPosition[h] = f;
    }
    out.maxGap = Math.max(out.maxGap, t.maxGap);
    out.steps += t.steps;
  }
  return out;
}

function addInto(a: Float64Array, b: Float64Array): void {
  for (let i = 0; i < a.length; i++) a[i]! += b[i]!;
}

/**
 * Runs one chunk: walks the base cycle over the chunk's copies, drops multiples of the primes in
 * (base, target], and tallies the target level's gaps and consecutive patterns that start in the
 * chunk. Pure and deterministic; cost ≈ (copyTo − copyFrom)·φ(base#) steps.
 * @param baseGaps the gap cycle of level `spec.base` ({@link wheelGaps}); may live in a SharedArrayBuffer.
 * @throws EngineError(input) for an invalid spec; EngineError(limit) when a gap exceeds 126.
 */
export function runWheelChunk(spec: WheelChunkSpec, baseGaps: Uint8Array): WheelChunkTally {
  const { base, target, copyFrom, copyTo, patternLength } = spec;
  checkSpecLevels(base, target);
  const copies = chunkCopies(base, target);
  if (!(Number.isInteger(copyFrom) && Number.isInteger(copyTo) && 0 <= copyFrom && copyFrom < copyTo && copyTo <= copies)) {
    throw inputError(`chunk copies [${copyFrom}, ${copyTo}) are not inside [0, ${copies})`);
  }
  const n = baseGaps.length;
  const B = cycleLength(baseGaps); // base# = sum of the base gaps
  // removal table modulo M = product of the removed primes
  const removedPrimes: number[] = [];
  for (let q = base + 1; q <= target; q++) if (isSmallPrime(q)) removedPrimes.push(q);
  const M = removedPrimes.reduce((a, q) => a * q, 1);
  if (M > 1 << 24) throw limitError(`streaming level ${target} over ${base} needs a removal table of ${M} entries`);
  const removed = new Uint8Array(M);
  for (const q of removedPrimes) for (let r = 0; r < M; r += q) removed[r] = 1;
  const radix = spec.radix ?? defaultChunkRadix(patternLength);
  if (!(Number.isInteger(radix) && radix >= 2 && (radix + 1) ** Math.max(patternLength, 1) <= 1 << 25)) {
    throw inputError(`chunk radix ${radix} is out of range for patterns of length ${patternLength}`);
  }
  const out = emptyChunkTally(target, patternLength, radix);
  const R = radix + 1;
  const S = radix; // sentinel half-gap
  const L = patternLength;
  const hist = out.histogram;
  const first = out.firstPosition;
  const pats = out.patterns;
  const lo = 1 + copyFrom * B;
  const hi = 1 + copyTo * B;
  let pos = lo;
  let acc = 0;
  let j = 0;
  // warm-up: advance to the first member ≥ lo of the target level
  for (let r0 = lo % M; removed[r0] === 1; j++) {
    const g = baseGaps[j]!;
    pos += g;
    r0 = (r0 + g) % M;
  }
  // bulk: every gap ending at a position ≤ hi starts below hi. Per copy c the removal test is a
  // lookup of the base member's residue in a table rotated by c·base# (mod M): no division per step.
  const res = baseResidues(baseGaps, M);
  const tab = new Uint8Array(M);
  const BmodM = B % M;
  // walk state: pos, acc, p1, p2, p3 (the last three half-gaps, S: none yet), maxGap
  const st = Float64Array.of(pos, 0, S, S, S);
  const seen = new Uint8Array(S);
  const wantFirst = spec.firstPositions === true;
  const dummy = new Float64Array(1);
  let steps = j;
  for (let c = copyFrom; c < copyTo; c++) {
    const shift = ((c % M) * BmodM) % M;
    for (let x = 0; x < M; x++) {
      const y = x + shift;
      tab[x] = removed[y >= M ? y - M : y]!;
    }
    st[1] = acc;
    const before = wantFirst ? seen.slice() : seen;
    const bad = walkCopy(baseGaps, res, tab, j, hist, pats ?? dummy, L, R, S, st);
    if (bad > 0) throw limitError(`gap ${bad} at level ${target} is above the tally bound ${2 * S - 2}`);
    // first positions: only copies that met a new gap value need the second pass
    let fresh = false;
    if (wantFirst) for (let h = 0; h < S; h++) if (hist[h]! > 0 && before[h] === 0) fresh = true;
    if (fresh) {
      firstPositions(baseGaps, res, tab, j, pos, acc, first, S);
      for (let h = 0; h < S; h++) if (hist[h]! > 0) seen[h] = 1;
    }
    pos = 1 + (c + 1) * B; // the walk ends exactly at the end of copy c
    acc = st[1]!;
    steps += n;
    j = 0;
  }
  let r = pos % M;
  const win = [st[2]!, st[3]!, st[4]!];
  let maxGap = 0;
  for (let h = 0; h < S; h++) if (hist[h]! > 0) maxGap = 2 * h;
  // tail: the patterns that start below hi but end beyond it
  const recent: number[] = []; // last complete gaps, most recent first (up to L − 1)
  for (let i = 0; i < L - 1 && win[i] !== S; i++) recent.push(2 * win[i]!);
  for (;;) {
    let start = pos - acc; // first member of the gap in progress
    for (const g of recent) start -= g;
    if (start >= hi) break; // no unfinished pattern starts below hi
    const g = baseGaps[j]!;
    j = j + 1 === n ? 0 : j + 1;
    steps++;
    pos += g;
    acc += g;
    r = (r + g) % M;
    if (removed[r] === 1) continue;
    const gapStart = pos - acc;
    const h = acc >> 1;
    if (h >= S) throw limitError(`gap ${acc} at level ${target} is above the tally bound ${2 * S - 2}`);
    if (gapStart < hi) {
      if (wantFirst && first[h]! < 0) first[h] = gapStart;
      hist[h]!++;
      if (acc > maxGap) maxGap = acc;
    }
    if (pats !== null && recent.length === L - 1) {
      let patStart = gapStart;
      let idx = 0;
      for (let i = L - 2; i >= 0; i--) {
        patStart -= recent[i]!;
        idx = idx * R + (recent[i]! >> 1);
      }
      if (patStart < hi) pats[idx * R + h]!++;
    }
    recent.unshift(acc);
    if (recent.length > L - 1) recent.pop();
    acc = 0;
  }
  out.maxGap = maxGap;
  out.steps = steps;
  return out;
}

const lengthCache = new WeakMap<Uint8Array, number>();

/** Sum of a gap cycle (its modulus), cached per array. */
function cycleLength(gaps: Uint8Array): number {
  const hit = lengthCache.get(gaps);
  if (hit !== undefined) return hit;
  let B = 0;
  for (let j = 0; j < gaps.length; j++) B += gaps[j]!;
  lengthCache.set(gaps, B);
  return B;
}

const residueCache = new Map<string, Uint16Array>();

/**
 * res[j] = (member after gap j of the base cycle) mod M, members counted from 1 within one copy.
 * Cached per (cycle length, M) — the cycle of a level is unique, so its length identifies it.
 */
function baseResidues(baseGaps: Uint8Array, M: number): Uint16Array {
  if (M > 65535) throw limitError(`removal modulus ${M} is above 65535`);
  const key = `${baseGaps.length}:${M}`;
  const hit = residueCache.get(key);
  if (hit) return hit;
  const res = new Uint16Array(baseGaps.length);
  let m = 1 % M;
  for (let j = 0; j < baseGaps.length; j++) {
    m += baseGaps[j]!;
    while (m >= M) m -= M;
    res[j] = m;
  }
  if (residueCache.size > 4) residueCache.clear();
  residueCache.set(key, res);
  return res;
}

/**
 * The hot loop over one copy of the base cycle from index j0 (kept small and integer-typed so that
 * it optimizes well). State st = [pos, acc, p1, p2, p3]; pos advances by whole copies outside.
 * Returns 0, or the offending gap when a gap does not fit the tally.
 */
function walkCopy(
  gaps: Uint8Array, res: Uint16Array, tab: Uint8Array, j0: number, hist: Float64Array,
  pats: Float64Array, L: number, R: number, S: number, st: Float64Array,
): number {
  let acc = st[1]! | 0;
  let p1 = st[2]! | 0;
  let p2 = st[3]! | 0;
  let p3 = st[4]! | 0;
  const n = gaps.length;
  for (let j = j0; j < n; j++) {
    acc += gaps[j]!;
    if (tab[res[j]!] === 0) {
      const h = acc >> 1;
      if (h >= S) return acc;
      hist[h]!++;
      if (L >= 2) {
        const idx = L === 2 ? p1 * R + h : L === 3 ? (p2 * R + p1) * R + h : ((p3 * R + p2) * R + p1) * R + h;
        pats[idx]!++;
        p3 = p2;
        p2 = p1;
        p1 = h;
      }
      acc = 0;
    }
  }
  st[1] = acc;
  st[2] = p1;
  st[3] = p2;
  st[4] = p3;
  return 0;
}

/** Records the first member position of each gap of one copy (a cheap second pass when a gap is new). */
function firstPositions(gaps: Uint8Array, res: Uint16Array, tab: Uint8Array, j0: number, pos0: number, acc0: number, first: Float64Array, S: number): void {
  let pos = pos0;
  let acc = acc0;
  for (let j = j0; j < gaps.length; j++) {
    const g = gaps[j]!;
    pos += g;
    acc += g;
    if (tab[res[j]!] === 0) {
      const h = acc >> 1;
      if (h < S && first[h]! < 0) first[h] = pos - acc;
      acc = 0;
    }
  }
}

/** Plain-JSON form of a chunk tally (dense arrays as sparse [index, count] pairs) for queues and files. */
export interface WheelChunkTallyJson {
  readonly target: number;
  readonly radix: number;
  readonly patternLength: number;
  readonly histogram: Array<[number, number]>;
  readonly patterns: Array<[number, number]> | null;
  readonly firstPosition: Array<[number, number]>;
  readonly maxGap: number;
  readonly steps: number;
}

function sparse(a: Float64Array, skip: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let i = 0; i < a.length; i++) if (a[i] !== skip) out.push([i, a[i]!]);
  return out;
}

/** Encodes a chunk tally as plain JSON-safe data (counts are exact integers < 2^53). */
export function wheelChunkTallyToJson(t: WheelChunkTally): WheelChunkTallyJson {
  return {
    target: t.target,
    radix: t.radix,
    patternLength: t.patternLength,
    histogram: sparse(t.histogram, 0),
    patterns: t.patterns ? sparse(t.patterns, 0) : null,
    firstPosition: sparse(t.firstPosition, -1),
    maxGap: t.maxGap,
    steps: t.steps,
  };
}

/**
 * Decodes {@link wheelChunkTallyToJson}.
 * @throws EngineError(input) when an index lies outside the tally or a count is not a safe integer.
 */
export function wheelChunkTallyFromJson(j: WheelChunkTallyJson): WheelChunkTally {
  const t = emptyChunkTally(j.target, j.patternLength, j.radix);
  const fill = (a: Float64Array | null, pairs: Array<[number, number]> | null, name: string) => {
    if (!pairs) return;
    if (!a) throw inputError(`chunk tally of length ${j.patternLength} has no ${name}`);
    for (const [i, v] of pairs) {
      if (!Number.isInteger(i) || i < 0 || i >= a.length || !Number.isSafeInteger(v)) {
        throw inputError(`chunk tally ${name} entry [${i}, ${v}] is out of range`);
      }
      a[i] = v;
    }
  };
  fill(t.histogram, j.histogram, 'histogram');
  fill(t.patterns, j.patterns, 'patterns');
  fill(t.firstPosition, j.firstPosition, 'first positions');
  t.maxGap = j.maxGap;
  t.steps = j.steps;
  return t;
}
