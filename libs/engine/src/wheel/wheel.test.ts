import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { histogramByCounts } from '../counts/enumerated';
import {
  combineWheelChunks, cycleHistogramAndPairSums, gapHistogram, histogramMaxGap, nextHistogram, nextPairTally,
  pairSums, patternsFromDense, planWheelChunks, primorial, primorialTotient, runWheelChunk, scanGapCycle,
  wheelChunkTallyFromJson, wheelChunkTallyToJson, wheelGaps, wheelLevel, wheelLevelStats, wheelMembers, type GapHistogram,
} from './index';

const LEVELS = [2, 3, 5, 7, 11, 13, 17, 19, 23];
const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
const totals = (h: GapHistogram) => {
  let n = 0n;
  let len = 0n;
  for (const [g, v] of h) {
    n += v;
    len += BigInt(g) * v;
  }
  return { n, len };
};

describe('primorials and φ(p#)', () => {
  it('match OEIS A002110 (primorials) and A005867 (φ of primorials)', () => {
    const levels = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37];
    // OEIS A002110
    const A002110 = [2n, 6n, 30n, 210n, 2310n, 30030n, 510510n, 9699690n, 223092870n, 6469693230n, 200560490130n, 7420738134810n];
    // OEIS A005867
    const A005867 = [1n, 2n, 8n, 48n, 480n, 5760n, 92160n, 1658880n, 36495360n, 1021870080n, 30656102400n, 1103619686400n];
    expect(levels.map(primorial)).toEqual(A002110);
    expect(levels.map(primorialTotient)).toEqual(A005867);
  });
  it('agrees with the length of the enumerated gap cycle (second path)', () => {
    for (const p of LEVELS) expect(BigInt(wheelGaps(p).length)).toBe(primorialTotient(p));
  });
  it('refuses levels that are not primes, and huge levels', () => {
    expect(() => primorial(9)).toThrow(/wheel level 9 is not a prime/);
    expect(() => primorial(1_000_003)).toThrow(EngineError);
    expect(() => wheelGaps(29)).toThrow(/above the limit 23/);
  });
});

describe('gap cycles', () => {
  it('level 5 is 1, 7, 11, 13, 17, 19, 23, 29 → gaps 6 4 2 4 2 4 6 2', () => {
    expect(Array.from(wheelGaps(5))).toEqual([6, 4, 2, 4, 2, 4, 6, 2]);
  });
  it('members are exactly the integers in [1, p#] coprime to p# (brute force to 13#)', () => {
    for (const p of [2, 3, 5, 7, 11, 13]) {
      const P = Number(primorial(p));
      const brute: number[] = [];
      for (let x = 1; x <= P; x++) if (gcd(x, P) === 1) brute.push(x);
      expect(Array.from(wheelMembers(p))).toEqual(brute);
    }
  });
  it('Σ n_g = φ(p#) and Σ g·n_g = p# at every enumerated level, and by the deeper paths', () => {
    for (const p of LEVELS) {
      const t = totals(cycleHistogramAndPairSums(wheelGaps(p)).histogram);
      expect(t).toEqual({ n: primorialTotient(p), len: primorial(p) });
    }
    for (const p of [29, 31]) expect(totals(gapHistogram(p))).toEqual({ n: primorialTotient(p), len: primorial(p) });
    expect(totals(histogramByCounts(37))).toEqual({ n: primorialTotient(37), len: primorial(37) });
  });
});

describe('Jacobsthal values of primorials (largest gap)', () => {
  // OEIS A048670: Jacobsthal function of the first primorials
  const A048670 = [2, 4, 6, 10, 14, 22, 26, 34, 40, 46];
  const ten = [...LEVELS, 29];
  it('by enumeration (≤ 23#) and the histogram recursion (29#)', () => {
    expect(ten.map((p) => (p <= 23 ? scanGapCycle(wheelGaps(p), []).maxGap : wheelLevel(p).maxGap))).toEqual(A048670);
  });
  it('by inclusion–exclusion counts alone (second path)', () => {
    expect(ten.map((p) => histogramMaxGap(histogramByCounts(p)))).toEqual(A048670);
  });
});

describe('histogram recursion hist_p = (p−2)·hist_P + T2_P', () => {
  it('reproduces the enumerated histogram of every level 3 … 23 from the level before', () => {
    for (let i = 1; i < LEVELS.length; i++) {
      const prev = cycleHistogramAndPairSums(wheelGaps(LEVELS[i - 1]!));
      const next = nextHistogram(prev.histogram, prev.pairSums, LEVELS[i]!);
      expect(next).toEqual(cycleHistogramAndPairSums(wheelGaps(LEVELS[i]!)).histogram);
    }
  });
  it('agrees with the inclusion–exclusion histograms at 29# and 31#', () => {
    expect(gapHistogram(29)).toEqual(histogramByCounts(29));
    expect(gapHistogram(31)).toEqual(histogramByCounts(31));
  });
  it('refuses to merge when removed members could be adjacent', () => {
    const fake = new Map([[2, 1n], [14, 1n]]);
    expect(() => nextHistogram(fake, new Map(), 7)).toThrow(/maxGap\(5#\) < 14, but it is 14/);
  });
});

describe('pair-tally recursion from the quadruples of the level before', () => {
  it('reproduces the enumerated ordered pair tallies of levels 7 … 19', () => {
    for (const [P, p] of [[5, 7], [7, 11], [11, 13], [13, 17], [17, 19]] as const) {
      const quads = scanGapCycle(wheelGaps(P), [4]).patterns.get(4)!;
      expect(nextPairTally(quads, p)).toEqual(scanGapCycle(wheelGaps(p), [2]).patterns.get(2)!);
    }
  });
  it('refuses levels whose gaps could put two removed members side by side', () => {
    expect(() => nextPairTally(new Map([['2,14,2,4', 1n]]), 7)).toThrow(/gaps of 5# below 14, found 14/);
  });
  it('gives the pair sums of 23# used by the 29# histogram', () => {
    const quads = scanGapCycle(wheelGaps(19), [4]).patterns.get(4)!;
    expect(pairSums(nextPairTally(quads, 23))).toEqual(cycleHistogramAndPairSums(wheelGaps(23)).pairSums);
  });
});

describe('streamed chunks', () => {
  it('partition the cycle: any split, combined, equals the in-memory scan', () => {
    for (const [base, target, counts] of [[7, 13, [1, 5]], [5, 13, [3]], [11, 17, [1, 7]], [13, 19, [4]]] as const) {
      const scan = scanGapCycle(wheelGaps(target), [2, 3, 4]);
      for (const L of [1, 2, 3, 4] as const) {
        for (const count of counts) {
          const t = combineWheelChunks(planWheelChunks(base, target, count, L, undefined, true).map((s) => runWheelChunk(s, wheelGaps(base))));
          expect(t.maxGap).toBe(scan.maxGap);
          expect(patternsFromDense(t.histogram, 1, t.radix).size).toBe(scan.histogram.size);
          for (const [g, v] of scan.histogram) expect(BigInt(t.histogram[g / 2]!)).toBe(v);
          for (const [g, m] of scan.firstPosition) expect(t.firstPosition[g / 2]).toBe(m);
          if (L >= 2) expect(patternsFromDense(t.patterns!, L, t.radix + 1, t.radix)).toEqual(scan.patterns.get(L));
        }
      }
    }
  });
  it('round-trip through JSON (for runner processes)', () => {
    const [a, b] = planWheelChunks(5, 11, 2, 3, undefined, true).map((s) => runWheelChunk(s, wheelGaps(5)));
    const back = combineWheelChunks([a!, b!].map((t) => wheelChunkTallyFromJson(JSON.parse(JSON.stringify(wheelChunkTallyToJson(t))))));
    const direct = combineWheelChunks([a!, b!]);
    expect(JSON.stringify(wheelChunkTallyToJson(back))).toBe(JSON.stringify(wheelChunkTallyToJson(direct)));
    expect(back.patterns!.length).toBe(65 ** 3);
    expect(() => wheelChunkTallyFromJson({ ...wheelChunkTallyToJson(a!), histogram: [[999, 1]] })).toThrow(/out of range/);
  });
  it('rejects chunk ranges outside the period', () => {
    expect(() => runWheelChunk({ base: 7, target: 13, copyFrom: 0, copyTo: 200, patternLength: 1 }, wheelGaps(7))).toThrow(/not inside \[0, 143\)/);
  });
});

describe('level statistics', () => {
  it('first positions are the least member starting each gap (brute force at 11#)', () => {
    const m = Array.from(wheelMembers(11));
    const first = new Map<number, number>();
    for (let i = 0; i < m.length; i++) {
      const g = (i + 1 < m.length ? m[i + 1]! : 2311) - m[i]!;
      if (!first.has(g)) first.set(g, m[i]!);
    }
    const s = wheelLevelStats(11);
    expect(new Map([...s.firstPosition].sort((a, b) => a[0] - b[0]))).toEqual(new Map([...first].sort((a, b) => a[0] - b[0])));
    expect(s.maxGap).toBe(14);
  });
  it('pattern tallies of every length sum to φ(p#)', () => {
    const s = wheelLevelStats(13);
    for (const L of [2, 3, 4]) {
      let total = 0n;
      for (const v of s.patterns.get(L)!.values()) total += v;
      expect(total).toBe(5760n);
    }
    expect(s.patterns.get(2)!.get('2,4')).toBe(s.patterns.get(2)!.get('4,2')); // symmetry x ↦ p# − x
  });
  it('refuses pattern lengths outside 2 … 4', () => {
    expect(() => wheelLevelStats(7, [5])).toThrow(/pattern length 5/);
  });
});
