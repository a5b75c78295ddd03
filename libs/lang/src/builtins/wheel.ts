import {
  checkedHistogram, gapHistogram, type GapHistogram, primorialTotient, wheelLevelStats, wheelMembers, checkLevel, primorial, splitHistograms,
  SPLIT_MAX_LEVEL,
} from '@cribra/engine';
import { domainError, limitError } from '../errors';
import type { StoredLevel } from '../provider/types';
import { SiftRecord, Table, type Value } from '../values/types';
import { argInt, argSeries, argSmall, type Builtin, type CallContext, defineBuiltins } from './registry';

/** Deepest level whose histogram is computed by the recursions inside a cell (31#: a few seconds). */
export const MAX_RECURSION_LEVEL = 31;
/** Deepest level computed on demand inside a cell: 37# … 47# by the split route; deeper ones must be stored. */
export const MAX_COMPUTED_LEVEL = SPLIT_MAX_LEVEL;
/** Split-route base up to 43# (19#: 1 658 880 members; 41# under a second, 43# about one); 47# uses 23#. */
const SMALL_SPLIT_BASE = 19;
/** Deepest level whose first positions and pattern tallies are computed on demand. */
export const MAX_STATS_LEVEL = 29;

function levelArg(a: Value[], i: number, c: CallContext, fn: string): number {
  const p = argSmall(a, i, c, fn, 2, 1_000_000);
  checkLevel(p);
  return p;
}

function stored(c: CallContext, p: number): StoredLevel | null {
  return c.data ? c.data.level(p) : null;
}

/** The gap histogram of level p: a stored level first, else computed (p ≤ 31). */
export function levelHistogram(c: CallContext, p: number, fn: string): GapHistogram {
  const s = stored(c, p);
  if (s) return new Map(s.histogram.map((e) => [e.gap, e.count]));
  if (p > MAX_COMPUTED_LEVEL) {
    throw limitError(`${fn}: level ${p} is not stored, and the engine computes gap histograms up to level ${MAX_COMPUTED_LEVEL}`, c.span);
  }
  const hit = computed.get(p);
  if (hit) return hit;
  const work = c.work(`gap histogram of level ${p}`);
  work.onProgress?.(0);
  // Σ n_g = φ(p#) and Σ g·n_g = p# checked before the histogram is used (stored levels were checked when stored)
  const h = checkedHistogram(p, p <= MAX_RECURSION_LEVEL ? gapHistogram(p, undefined, work) : splitHistograms([p], p <= 43 ? SMALL_SPLIT_BASE : 23, work).get(p)!);
  computed.set(p, h);
  c.progress(1, `gap histogram of level ${p}`);
  return h;
}

// Computed histograms are pure mathematics (small maps), so they are kept for the process.
const computed = new Map<number, GapHistogram>();

function histogramTable(h: GapHistogram): Table {
  return new Table(['gap', 'count'], [...h].sort((x, y) => x[0] - y[0]).map(([g, n]) => [BigInt(g), n]));
}

function maxGap(h: GapHistogram): number {
  let m = 0;
  for (const [g, n] of h) if (n > 0n && g > m) m = g;
  return m;
}

const wheel: Builtin[] = [
  {
    name: 'wheel', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'wheel(p) → record (level, modulus, members, maxgap)',
    doc: 'Wheel level p: the reduced residue system mod p#, its size φ(p#) and largest gap (the Jacobsthal value of p#).',
    example: { source: 'wheel(7)', result: '(level: 7, modulus: 210, members: 48, maxgap: 10)' },
    call: (a, c) => {
      const p = levelArg(a, 0, c, 'wheel');
      const h = levelHistogram(c, p, 'wheel');
      return SiftRecord.of([['level', BigInt(p)], ['modulus', primorial(p)], ['members', primorialTotient(p)], ['maxgap', BigInt(maxGap(h))]]);
    },
  },
  {
    name: 'wheelsize', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'wheelsize(p) → integer', doc: 'φ(p#) = ∏_{q ≤ p} (q − 1), the number of members of level p (any prime p ≤ 10^6).',
    example: { source: 'wheelsize(13)', result: '5760' },
    call: (a, c) => primorialTotient(levelArg(a, 0, c, 'wheelsize')),
  },
  {
    name: 'jacobsthal', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'jacobsthal(p) → integer', doc: 'The largest gap of level p (the largest gap with a non-zero count), i.e. the Jacobsthal function of p#.',
    example: { source: 'jacobsthal(13)', result: '22' },
    call: (a, c) => BigInt(maxGap(levelHistogram(c, levelArg(a, 0, c, 'jacobsthal'), 'jacobsthal'))),
  },
  {
    name: 'gaps', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'gaps(p) → table (gap, count)',
    doc: 'Gap histogram of level p over one period (stored levels are read, levels ≤ 47 computed).',
    example: { source: 'gaps(5)', result: 'table (gap, count): (2, 3), (4, 3), (6, 2)' },
    call: (a, c) => histogramTable(levelHistogram(c, levelArg(a, 0, c, 'gaps'), 'gaps')),
  },
  {
    name: 'gapcount', area: 'wheel', minArgs: 2, maxArgs: 2,
    signature: 'gapcount(g, p) → integer',
    doc: 'The number of gaps equal to g between consecutive members of level p, over one period.',
    example: { source: 'gapcount(6, 7)', result: '14' },
    call: (a, c) => {
      const g = argInt(a, 0, c, 'gapcount');
      const p = levelArg(a, 1, c, 'gapcount');
      if (g <= 0n) throw domainError('gapcount: the gap must be positive', c.argSpans[0]);
      return levelHistogram(c, p, 'gapcount').get(Number(g)) ?? 0n;
    },
  },
  {
    name: 'firstpositions', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'firstpositions(p) → table (gap, first)',
    doc: 'For each gap of level p (p ≤ 29) the least member m in [1, p#] followed by the gap m → m + g.',
    example: { source: 'firstpositions(5)', result: 'table (gap, first): (2, 11), (4, 7), (6, 1)' },
    call: (a, c) => {
      const p = levelArg(a, 0, c, 'firstpositions');
      if (p > MAX_STATS_LEVEL) throw limitError(`firstpositions: levels above ${MAX_STATS_LEVEL} are not scanned member by member`, c.span);
      const work = c.work(`scanning level ${p} for first positions`);
      work.onProgress?.(0);
      const s = wheelLevelStats(p, [], work);
      return new Table(['gap', 'first'], [...s.firstPosition].sort((x, y) => x[0] - y[0]).map(([g, m]) => [BigInt(g), BigInt(m)]));
    },
  },
  {
    name: 'tally', area: 'wheel', minArgs: 2, maxArgs: 2,
    signature: 'tally(p, L) → table (pattern, count)  |  tally(p, [g1, g2, …]) → integer',
    doc: 'Tallies of runs of L consecutive gaps (L = 2, 3, 4) over one period of level p; with a pattern, the count of that run.',
    example: { source: 'tally(7, [2, 4])', result: '8' },
    call: (a, c) => {
      const p = levelArg(a, 0, c, 'tally');
      const want = a[1];
      const pattern = typeof want === 'bigint' ? null : argSeries(a, 1, c, 'tally').map((g, i) => Number(argInt([g], 0, { ...c, argSpans: [c.argSpans[1] ?? c.span] }, `tally pattern element ${i + 1}`)));
      const L = pattern ? pattern.length : argSmall(a, 1, c, 'tally', 2, 4);
      if (L < 2 || L > 4) throw domainError('tally: runs of 2, 3 or 4 consecutive gaps', c.argSpans[1]);
      const tallies = patternTally(c, p, L);
      if (pattern) return tallies.get(pattern.join(',')) ?? 0n;
      return new Table(['pattern', 'count'], [...tallies].map(([k, n]) => [k.split(',').map((x) => BigInt(x)), n]));
    },
  },
  {
    name: 'members', area: 'wheel', minArgs: 1, maxArgs: 1,
    signature: 'members(p) → series', doc: 'The members of level p in [1, p#], increasing (p ≤ 17).',
    example: { source: 'members(5)', result: '[1, 7, 11, 13, 17, 19, 23, 29]' },
    call: (a, c) => {
      const p = levelArg(a, 0, c, 'members');
      if (p > 17) throw limitError('members: listing members is limited to levels ≤ 17 (92 160 members); use gaps or tally for deeper levels', c.span);
      const m = wheelMembers(p);
      c.tick(m.length);
      return Array.from(m, (x) => BigInt(x));
    },
  },
];

function patternTally(c: CallContext, p: number, L: number): Map<string, bigint> {
  const s = stored(c, p);
  const hit = s?.patternTallies.find((t) => t.length === L);
  if (hit) return new Map(hit.entries.map((e) => [e.pattern.join(','), e.count]));
  if (p > MAX_STATS_LEVEL) throw limitError(`tally: level ${p} has no stored tallies of length ${L}, and levels above ${MAX_STATS_LEVEL} are not scanned inside a cell`, c.span);
  const work = c.work(`scanning level ${p} for runs of ${L} gaps`);
  work.onProgress?.(0);
  const stats = wheelLevelStats(p, [L], work);
  return new Map(stats.patterns.get(L) ?? []);
}

defineBuiltins(wheel);
