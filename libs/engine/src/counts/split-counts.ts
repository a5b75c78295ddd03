import { inputError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { checkStop, type WorkHooks } from '../sieve/progress';
import { MAX_MEMORY_LEVEL, wheelGaps } from '../wheel/level-gaps';
import { checkLevel, previousPrime, primorial, primorialTotient } from '../wheel/primorial';
import type { GapHistogram } from '../wheel/tally';
import { genericCoverCounts, windowFirstUncovered } from './split-window';

/** Deepest level of the split route (the one this engine checks: the Jacobsthal value of 47# is 100). */
export const SPLIT_MAX_LEVEL = 47;
/** Base level of the split route by default: 23# is the deepest cycle held in memory. */
export const SPLIT_DEFAULT_BASE = MAX_MEMORY_LEVEL;

/**
 * The base level the split route uses for level p by default: 23# for 43# and 47#, 19# for 29# … 41#
 * (fewer members to walk, few windows needing the exact count), the level two primes below for
 * smaller levels (≥ 7).
 * @throws EngineError(input|limit) for p not a prime in 7 … 47.
 */
export function defaultSplitBase(p: number): number {
  checkLevel(p, SPLIT_MAX_LEVEL);
  if (p < 7) throw inputError(`split route: level ${p} is below 7`);
  if (p >= 43) return 23;
  if (p >= 29) return 19;
  return previousPrime(previousPrime(p));
}

/**
 * One chunk of the split route: the members y of each target level whose residue mod base# is one
 * of the base members with index in [from, to) (member 0 is 1). Chunks with `from`/`to` partitioning
 * [0, φ(base#)) partition every target level.
 */
export interface SplitChunkSpec {
  /** base level (in-memory cycle, ≤ 23) */
  readonly base: number;
  /** target levels, primes with base < p ≤ 47, increasing */
  readonly levels: readonly number[];
  readonly from: number;
  readonly to: number;
}

/** Partial gap counts of a chunk, per target level (plus what the chunk cost). */
export interface SplitChunkResult {
  readonly base: number;
  readonly from: number;
  readonly to: number;
  readonly levels: ReadonlyArray<{ readonly prime: number; readonly histogram: GapHistogram }>;
  /** windows that needed the exact count (some prime above the base meets two of their points), per level */
  readonly exactWindows: readonly number[];
  /** distinct such windows (each counted once), per level */
  readonly distinctWindows: readonly number[];
}

/** The same in plain JSON (counts as decimal strings), for queues and storage. */
export interface SplitChunkResultJson {
  readonly base: number;
  readonly from: number;
  readonly to: number;
  readonly levels: Array<{ prime: number; histogram: Array<[number, string]> }>;
  readonly exactWindows: number[];
  readonly distinctWindows: number[];
}

/**
 * Checks a split-route request: base a prime ≤ 23, levels primes with base < p ≤ 47 (increasing,
 * distinct).
 * @throws EngineError(input) or EngineError(limit) naming the value.
 */
export function checkSplitLevels(base: number, levels: readonly number[]): void {
  checkLevel(base, MAX_MEMORY_LEVEL);
  if (base < 3) throw inputError(`split route: base level ${base} is below 3`);
  if (levels.length === 0) throw inputError('split route: no target level');
  let prev = base;
  for (const p of levels) {
    checkLevel(p, SPLIT_MAX_LEVEL);
    if (p <= prev) throw inputError(`split route: target levels must be increasing primes above the base ${base}, got ${levels.join(', ')}`);
    prev = p;
  }
}

/** Splits the base members evenly into `count` chunks (fewer when the base has fewer members). */
export function planSplitChunks(base: number, levels: readonly number[], count: number): SplitChunkSpec[] {
  checkSplitLevels(base, levels);
  if (!Number.isSafeInteger(count) || count < 1) throw inputError(`chunk count ${count} is not a positive integer`);
  const n = Number(primorialTotient(base));
  const c = Math.min(count, n);
  return Array.from({ length: c }, (_, i) => ({
    base,
    levels: [...levels],
    from: Math.floor((i * n) / c),
    to: Math.floor(((i + 1) * n) / c),
  }));
}

interface LevelPlan {
  prime: number;
  primes: number[];
  /** K = |primes| + 1 points decide a window when no prime meets two of them */
  K: number;
  /** f[k] = E[k−1] − E[k]: members per base window whose gap ends at its k-th point (generic case) */
  f: bigint[];
  /** collide[d] = 1 when some prime of `primes` divides d (d > 0) */
  collide: Uint8Array;
  twiceLeast: number;
  /** per prime, residue counters for the capacity bound */
  counters: Int32Array[];
  windows: Map<string, number>;
  exact: number;
}

function planLevel(base: number, p: number, span: number): LevelPlan {
  const primes = Array.from(primesUpTo(p)).filter((q) => q > base);
  const E = genericCoverCounts(primes);
  const K = primes.length + 1;
  const f: bigint[] = [0n];
  for (let k = 1; k <= K; k++) f.push(E[k - 1]! - E[k]!);
  const collide = new Uint8Array(span + 1);
  for (let d = 1; d <= span; d++) if (primes.some((q) => d % q === 0)) collide[d] = 1;
  return { prime: p, primes, K, f, collide, twiceLeast: 2 * primes[0]!, counters: primes.map((q) => new Int32Array(q)), windows: new Map(), exact: 0 };
}

/**
 * Runs one chunk of the split route (a pure function of the spec and the base cycle).
 *
 * Why it is exact: by the Chinese remainder theorem a member y of level p is a pair (x, (c_q)) of a
 * base member x = y mod base# and residues c_q = y mod q ≠ 0 for the primes base < q ≤ p, every pair
 * occurring once. The members of the base level after x lie at x + w_1 < x + w_2 < …; y's gap is w_k
 * for the first k with every c_q + w_k ≢ 0 (mod q). So each base window contributes counts that depend
 * only on its offsets w_1, w_2, … ({@link windowFirstUncovered}). When no prime above the base meets
 * two of the points 0, w_1 … w_K (K = number of those primes + 1) — always when w_K < 2·(least such
 * prime) — each prime hits at most one point, the first K points can never all be hit, and the counts
 * are the generic f_k at w_k: the whole chunk then needs only the tallies T_k(g) = #{x : w_k = g}
 * (k-step sums of the base cycle, shared by every target level). The other windows ("exact windows")
 * are collected by their offsets and counted once per distinct window.
 *
 * `hooks` are polled every 2^20 base members.
 * @throws EngineError(input) for a bad spec; EngineError(limit) when stopped.
 */
export function runSplitChunk(spec: SplitChunkSpec, baseGaps: Uint8Array, hooks?: WorkHooks): SplitChunkResult {
  const { base, levels, from, to } = spec;
  checkSplitLevels(base, levels);
  const n = baseGaps.length;
  if (!(Number.isSafeInteger(from) && Number.isSafeInteger(to) && from >= 0 && from <= to && to <= n)) {
    throw inputError(`split chunk [${from}, ${to}) is not inside the ${n} members of level ${base}`);
  }
  const baseMax = 255; // a gap of the base cycle fits one byte (no scan of the whole cycle per chunk)
  // K of the deepest level (the most primes above the base) bounds every window's first K points
  const Kmax = Array.from(primesUpTo(levels[levels.length - 1]!)).filter((q) => q > base).length + 1;
  const span = Kmax * baseMax;
  const plans = levels.map((p) => planLevel(base, p, span));
  const stride = span + 1;
  const T = new Float64Array((Kmax + 1) * stride); // T[k·stride + w] — counts ≤ φ(23#) < 2^53
  const w = new Int32Array(Kmax + 1);
  const points: number[] = [];
  for (let i = from; i < to; i++) {
    if ((i & 0xfffff) === 0 && i > from) checkStop(hooks, `counting the gaps of level ${levels[levels.length - 1]} over level ${base}`);
    let s = 0;
    let j = i;
    for (let k = 1; k <= Kmax; k++) {
      s += baseGaps[j]!;
      if (++j === n) j = 0;
      w[k] = s;
      T[k * stride + s]++;
    }
    for (const lv of plans) {
      const K = lv.K;
      if (w[K]! < lv.twiceLeast) continue;
      const col = lv.collide;
      let hit = false;
      for (let b = 1; b <= K && !hit; b++) {
        const wb = w[b]!;
        if (wb < lv.twiceLeast) continue;
        if (col[wb]) hit = true;
        for (let a = 1; a < b && !hit; a++) if (col[wb - w[a]!]) hit = true;
      }
      if (!hit) continue;
      lv.exact++;
      points.length = 0;
      exactWindow(lv, baseGaps, i, points);
      const key = points.join(',');
      lv.windows.set(key, (lv.windows.get(key) ?? 0) + 1);
    }
  }
  const out = plans.map((lv) => {
    const acc = new Map<number, bigint>();
    const add = (g: number, v: bigint) => acc.set(g, (acc.get(g) ?? 0n) + v);
    for (let k = 1; k <= lv.K; k++) {
      for (let g = 0; g <= span; g++) {
        const t = T[k * stride + g]!;
        if (t) add(g, BigInt(t) * lv.f[k]!);
      }
    }
    for (const [key, count] of lv.windows) {
      const pts = key.split(',').map(Number);
      const F = cachedWindow(lv.prime, key, pts, lv.primes);
      const m = BigInt(count);
      for (let k = 1; k < F.length; k++) if (F[k]) add(pts[k - 1]!, m * F[k]!);
      for (let k = 1; k <= lv.K; k++) add(pts[k - 1]!, -m * lv.f[k]!); // undo the generic count taken above
    }
    const histogram = new Map<number, bigint>();
    for (const g of [...acc.keys()].sort((a, b) => a - b)) {
      const v = acc.get(g)!;
      if (v < 0n) throw new Error(`internal: split chunk count of gap ${g} at level ${lv.prime} is negative`);
      if (v > 0n) histogram.set(g, v);
    }
    return { prime: lv.prime, histogram };
  });
  hooks?.onProgress?.(1);
  return {
    base, from, to, levels: out,
    exactWindows: plans.map((l) => l.exact),
    distinctWindows: plans.map((l) => l.windows.size),
  };
}

// The exact count of a window depends only on its offsets and the primes above the base, so it is
// kept across chunks: chunks of one level meet the same windows again (47# over 23# in 16 chunks:
// 244 490 windows to count without this, 51 931 distinct). Bounded; pure mathematics.
const WINDOW_CACHE_LIMIT = 200_000;
const windowCache = new Map<string, bigint[]>();

function cachedWindow(prime: number, key: string, points: number[], primes: readonly number[]): bigint[] {
  const k = `${primes[0]}-${prime}:${key}`;
  const hit = windowCache.get(k);
  if (hit) return hit;
  const F = windowFirstUncovered(points, primes);
  if (windowCache.size >= WINDOW_CACHE_LIMIT) windowCache.clear();
  windowCache.set(k, F);
  return F;
}

/** Drops the split route's cache of counted windows (a few tens of MB after 47#). */
export function clearSplitWindowCache(): void {
  windowCache.clear();
}

/**
 * Offsets of the window that decides base member i at this level: the first K points, then more until
 * the primes above the base cannot hit them all (each prime hits one residue class, so at most its
 * largest class among the points).
 */
function exactWindow(lv: LevelPlan, gaps: Uint8Array, i: number, points: number[]): void {
  const n = gaps.length;
  const Q = lv.primes.length;
  const maxClass = new Int32Array(Q);
  let s = 0;
  let j = i;
  for (let M = 1; ; M++) {
    s += gaps[j]!;
    if (++j === n) j = 0;
    points.push(s);
    let cap = 0;
    for (let t = 0; t < Q; t++) {
      const c = ++lv.counters[t]![s % lv.primes[t]!]!;
      if (c > maxClass[t]!) maxClass[t] = c;
      cap += maxClass[t]!;
    }
    if (M >= lv.K && cap < M) break;
  }
  for (let t = 0; t < Q; t++) {
    const q = lv.primes[t]!;
    for (const x of points) lv.counters[t]![x % q] = 0;
  }
}

/** Adds the partial results of chunks over the same base and levels (order-free). */
export function combineSplitChunks(parts: readonly SplitChunkResult[]): SplitChunkResult {
  if (parts.length === 0) throw inputError('no split chunks to combine');
  const first = parts[0]!;
  const levels = first.levels.map((l) => l.prime);
  const acc = levels.map(() => new Map<number, bigint>());
  const exact = levels.map(() => 0);
  const distinct = levels.map(() => 0);
  for (const part of parts) {
    if (part.base !== first.base || part.levels.map((l) => l.prime).join(',') !== levels.join(',')) {
      throw inputError('split chunks of different bases or levels cannot be combined');
    }
    part.levels.forEach((l, i) => {
      for (const [g, v] of l.histogram) acc[i]!.set(g, (acc[i]!.get(g) ?? 0n) + v);
      exact[i] += part.exactWindows[i]!;
      distinct[i] += part.distinctWindows[i]!;
    });
  }
  const from = Math.min(...parts.map((p) => p.from));
  const to = Math.max(...parts.map((p) => p.to));
  return {
    base: first.base, from, to,
    levels: levels.map((prime, i) => ({ prime, histogram: new Map([...acc[i]!].sort((a, b) => a[0] - b[0])) })),
    exactWindows: exact,
    distinctWindows: distinct,
  };
}

export function splitChunkResultToJson(r: SplitChunkResult): SplitChunkResultJson {
  return {
    base: r.base, from: r.from, to: r.to,
    levels: r.levels.map((l) => ({ prime: l.prime, histogram: [...l.histogram].map(([g, v]): [number, string] => [g, v.toString()]) })),
    exactWindows: [...r.exactWindows],
    distinctWindows: [...r.distinctWindows],
  };
}

/** @throws EngineError(input) for a malformed object. */
export function splitChunkResultFromJson(j: SplitChunkResultJson): SplitChunkResult {
  if (!j || !Array.isArray(j.levels)) throw inputError('not a split chunk result');
  return {
    base: j.base, from: j.from, to: j.to,
    levels: j.levels.map((l) => ({ prime: l.prime, histogram: new Map(l.histogram.map(([g, v]) => [g, BigInt(v)])) })),
    exactWindows: [...j.exactWindows],
    distinctWindows: [...j.distinctWindows],
  };
}

/** The two identities of a full histogram of level p, as computed and as required. */
export interface HistogramIdentities {
  readonly members: bigint;
  readonly length: bigint;
  readonly phi: bigint;
  readonly modulus: bigint;
  readonly holds: boolean;
}

/** Σ n_g (must be φ(p#)) and Σ g·n_g (must be p#) of a histogram of level p. */
export function histogramIdentities(p: number, h: GapHistogram): HistogramIdentities {
  let members = 0n;
  let length = 0n;
  for (const [g, v] of h) {
    members += v;
    length += BigInt(g) * v;
  }
  const phi = primorialTotient(p);
  const modulus = primorial(p);
  return { members, length, phi, modulus, holds: members === phi && length === modulus };
}

/**
 * Checks Σ n_g = φ(p#) and Σ g·n_g = p# and returns the histogram unchanged.
 * @throws Error (internal: a wrong or incomplete histogram is a bug or a missing chunk, never user input).
 */
export function checkedHistogram(p: number, h: GapHistogram): GapHistogram {
  const id = histogramIdentities(p, h);
  if (!id.holds) {
    throw new Error(`level ${p}: the gap counts sum to ${id.members} members and length ${id.length}, not φ(${p}#) = ${id.phi} and ${p}# = ${id.modulus}`);
  }
  return h;
}

/** Histograms of whole levels from a combined result covering every base member, each checked. */
export function splitHistogramsFromResult(r: SplitChunkResult): Map<number, GapHistogram> {
  const n = Number(primorialTotient(r.base));
  if (r.from !== 0 || r.to !== n) throw inputError(`the split chunks cover members [${r.from}, ${r.to}) of level ${r.base}, not all ${n}`);
  return new Map(r.levels.map((l) => [l.prime, checkedHistogram(l.prime, l.histogram)]));
}

/**
 * Gap histograms of the levels `levels` (primes above `base`, ≤ 47) by the split route in this
 * thread: one pass over the base cycle (23# by default: 36 495 360 members, several seconds) gives
 * every gap of every level at once; each histogram is checked by Σ n_g = φ(p#) and Σ g·n_g = p#.
 * `hooks` get the fraction done per chunk (16 chunks) and may stop it.
 * @throws EngineError(input|limit) for bad levels or when stopped.
 */
export function splitHistograms(levels: readonly number[], base = SPLIT_DEFAULT_BASE, hooks?: WorkHooks): Map<number, GapHistogram> {
  const specs = planSplitChunks(base, levels, 16);
  const gaps = wheelGaps(base);
  const what = `counting the gaps of level ${levels[levels.length - 1]}`;
  const parts = specs.map((s, i) => {
    checkStop(hooks, what);
    const part = runSplitChunk(s, gaps, hooks ? { shouldStop: hooks.shouldStop } : undefined);
    hooks?.onProgress?.((i + 1) / specs.length, what);
    return part;
  });
  return splitHistogramsFromResult(combineSplitChunks(parts));
}
