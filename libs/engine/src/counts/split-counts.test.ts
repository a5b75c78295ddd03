import { describe, expect, it } from 'vitest';
import { cycleHistogramAndPairSums } from '../wheel/scan';
import { wheelGaps } from '../wheel/level-gaps';
import { gapHistogram } from '../wheel/level';
import { histogramMaxGap, type GapHistogram } from '../wheel/tally';
import {
  checkedHistogram, combineSplitChunks, histogramIdentities, planSplitChunks, runSplitChunk, splitChunkResultFromJson,
  splitChunkResultToJson, splitHistograms, splitHistogramsFromResult,
} from './split-counts';
import { genericCoverCounts, windowFirstUncovered } from './split-window';
import { histogramByCounts } from './enumerated';

const enumerated = (p: number): GapHistogram => cycleHistogramAndPairSums(wheelGaps(p)).histogram;

/** The same window count by trying every residue choice (an independent path for small primes). */
function bruteWindow(points: number[], primes: number[]): bigint[] {
  const F = points.map(() => 0n);
  F.unshift(0n);
  const c = primes.map(() => 1);
  for (;;) {
    let k = 1;
    while (k <= points.length && primes.some((q, i) => (c[i]! + points[k - 1]!) % q === 0)) k++;
    if (k > points.length) throw new Error('window too short');
    F[k]! += 1n;
    let i = 0;
    while (i < primes.length && ++c[i]! === primes[i]!) c[i++] = 1;
    if (i === primes.length) return F;
  }
}

describe('split route: one window', () => {
  it('counts the members whose gap ends at each point like trying every residue choice', () => {
    const primes = [5, 7, 11]; // the third window has many points in one class mod 5, 7 and 11
    for (const points of [[2, 4, 6, 8], [4, 10, 14, 20, 22], [2, 12, 14, 22, 24, 26, 30, 32, 34], [6, 10, 12, 16, 18, 22]]) {
      expect(windowFirstUncovered(points, primes)).toEqual(bruteWindow(points, primes));
    }
  });
  it('E[n], the generic case: 2 primes above the base, points distinct mod both', () => {
    // E0 = 28·30 choices; E1 = 28·30 − 27·29 hit a given point (29 hits: 30, 31 hits: 28, both: 1);
    // E2 = 2 (each prime hits one of the two points); three points cannot all be hit
    expect(genericCoverCounts([29, 31])).toEqual([840n, 57n, 2n, 0n]);
  });
  it('refuses a window that can be covered entirely (the caller must extend it)', () => {
    expect(() => windowFirstUncovered([2, 4], [5, 7, 11])).toThrow(/covered entirely/);
  });
});

describe('split route: whole histograms', () => {
  it('equals the enumerated histogram of every level 7 … 23 from several bases', () => {
    for (const [base, levels] of [[3, [5, 7, 11, 13]], [5, [7, 11, 13, 17, 19]], [11, [13, 17, 19, 23]], [13, [17, 19, 23]], [19, [23]]] as const) {
      const got = splitHistograms(levels, base);
      for (const p of levels) expect(got.get(p)).toEqual(enumerated(p));
    }
  });
  it('equals the histogram recursion at 29# and 31# (bases 13 and 19)', () => {
    const rec = [29, 31].map((p) => gapHistogram(p));
    for (const base of [13, 19]) {
      const got = splitHistograms([29, 31], base);
      expect([got.get(29), got.get(31)]).toEqual(rec);
    }
  });
  it('equals the closed-form counts at 37# and 41# (bases 17 and 19); Jacobsthal of 41# = 74 (OEIS A048670)', () => {
    const a = splitHistograms([37, 41], 17);
    const b = splitHistograms([37, 41], 19);
    expect(b.get(37)).toEqual(a.get(37));
    expect(b.get(41)).toEqual(a.get(41));
    expect(a.get(37)).toEqual(histogramByCounts(37));
    // OEIS A048670: j(37#) = 66, j(41#) = 74
    expect([histogramMaxGap(a.get(37)!), histogramMaxGap(a.get(41)!)]).toEqual([66, 74]);
  });
  // OEIS A048670 (Jacobsthal function of the primorials): j(41#) = 74, j(43#) = 90, j(47#) = 100
  it('Jacobsthal values of 41# and 43#: 74 and 90 (OEIS A048670), from the largest non-zero count, over 19# and 23#', () => {
    const over19 = splitHistograms([41, 43], 19); // Σ n_g = φ(p#) and Σ g·n_g = p# checked inside
    expect([41, 43].map((p) => histogramMaxGap(over19.get(p)!))).toEqual([74, 90]);
    for (const p of [41, 43]) expect(histogramIdentities(p, over19.get(p)!).holds).toBe(true);
    // a different windowing (over 23#, other windows need the exact count) gives the same histograms
    const over23 = splitHistograms([41, 43], 23);
    expect([over23.get(41), over23.get(43)]).toEqual([over19.get(41), over19.get(43)]);
  }, 300_000);
  it('Jacobsthal value of 47#: 100 (OEIS A048670); n2 = ∏(q − 2) (OEIS A059861) as the closed form says', () => {
    const h = splitHistograms([47], 23).get(47)!; // about 5 s of one core unloaded
    expect(histogramMaxGap(h)).toBe(100);
    expect(histogramIdentities(47, h).holds).toBe(true);
    expect(h.get(2)).toBe([3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47].reduce((s, q) => s * BigInt(q - 2), 1n));
    expect(h.get(4)).toBe(h.get(2)); // n4 = n2 at every level (closed forms ∏(q−2) and ∏(q−2) − ∏(q−3) agree)
  }, 300_000);
  it('chunks partition the work: any split into chunks, through JSON, gives the one-pass result', () => {
    const whole = splitHistograms([29, 31, 37], 13);
    const gaps = wheelGaps(13);
    const parts = planSplitChunks(13, [29, 31, 37], 7).map((s) => splitChunkResultFromJson(JSON.parse(JSON.stringify(splitChunkResultToJson(runSplitChunk(s, gaps))))));
    const combined = splitHistogramsFromResult(combineSplitChunks(parts.reverse()));
    expect(combined).toEqual(whole);
    expect(() => splitHistogramsFromResult(combineSplitChunks(parts.slice(1)))).toThrow(/cover members/);
  });
  it('the identities catch a wrong count', () => {
    const h = new Map(enumerated(11));
    expect(histogramIdentities(11, h).holds).toBe(true);
    h.set(4, h.get(4)! + 1n);
    h.set(2, h.get(2)! - 2n);
    h.set(6, h.get(6)! + 1n); // members unchanged, length + 4 − 4 + 6 … ≠ 11#
    expect(() => checkedHistogram(11, h)).toThrow(/not φ\(11#\) = 480 and 11# = 2310/);
  });
  it('refuses bad levels', () => {
    expect(() => splitHistograms([53], 23)).toThrow(/above the limit 47/);
    expect(() => splitHistograms([19], 23)).toThrow(/increasing primes above the base 23/);
    expect(() => splitHistograms([31], 29)).toThrow(/above the limit 23/);
  });
});
