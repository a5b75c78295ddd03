import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { EngineError } from '../errors';
import { isAdmissible } from '../tuple/admissibility';
import { cycleHistogramAndPairSums } from '../wheel/scan';
import { gapHistogram } from '../wheel/level';
import { wheelGaps, wheelMembers } from '../wheel/level-gaps';
import { primorial, primorialTotient } from '../wheel/primorial';
import {
  enumeratedPatternCount, evaluateClosedForm, gapClosedForm, gapCount, histogramByCounts, occurrenceCount,
  patternClosedForm, patternCount,
} from './index';

const LEVELS = [3, 5, 7, 11, 13, 17, 19, 23];
const histCache = new Map<number, ReturnType<typeof cycleHistogramAndPairSums>['histogram']>();
const hist = (p: number) => {
  if (!histCache.has(p)) histCache.set(p, cycleHistogramAndPairSums(wheelGaps(p)).histogram);
  return histCache.get(p)!;
};

describe('occurrences of an admissible tuple in one period', () => {
  it('∏(q − ν_q(H)) agrees with counting members x with x + H all members (brute force to 13#)', () => {
    for (const H of [[0, 2], [0, 2, 6], [0, 4, 6, 10], [0, 2, 6, 8, 12], [0, 6, 12, 18, 24, 30]]) {
      for (const p of [5, 7, 11, 13]) {
        const P = Number(primorial(p));
        const isMember = new Uint8Array(P + 1);
        for (const m of wheelMembers(p)) isMember[m] = 1;
        let brute = 0;
        for (const x of wheelMembers(p)) if (H.every((h) => isMember[((x - 1 + h) % P) + 1] === 1)) brute++;
        expect(occurrenceCount(H, p)).toBe(BigInt(brute));
      }
    }
  });
  it('is 0 for a tuple that is not admissible at the level, and refuses bad input', () => {
    expect(occurrenceCount([0, 2, 4], 3)).toBe(0n);
    expect(occurrenceCount([0, 2, 4], 2)).toBe(1n);
    expect(() => occurrenceCount([0, 2], 4)).toThrow(/not a prime/);
    expect(() => occurrenceCount([0, 2, 2], 5)).toThrow(/duplicate offset 2/);
  });
  it('reaches level 10^6 exactly (twin pattern: ∏_{3 ≤ q ≤ p}(q − 2))', () => {
    const n = occurrenceCount([0, 2], 999_983);
    expect(n > 10n ** 400_000n).toBe(true);
    expect(n % 3n).toBe(0n); // the factor 5 − 2 = 3 divides it
    expect(occurrenceCount([0, 2], 29)).toBe(214708725n); // = n2(29#), the 29# histogram's twin gaps
  });
});

describe('closed forms of consecutive gap counts', () => {
  it('gap 6 is 2·∏(q−2) − 2·∏(q−3) over primes 5 ≤ q ≤ p (OEIS A271564)', () => {
    const f = gapClosedForm(6);
    expect(f.text).toBe('2·∏(q−2) − 2·∏(q−3)');
    expect(f.from).toBe(5);
    expect(f.validFrom).toBe(3);
  });
  it('gaps 2 and 4 are both ∏_{3≤q≤p}(q−2) in count (OEIS A059861); 8 and 10 as below', () => {
    expect(gapClosedForm(2).text).toBe('∏(q−2)');
    expect(gapClosedForm(4).text).toBe('∏(q−2) − ∏(q−3)'); // over 3 ≤ q ≤ p; the q = 3 factor of ∏(q−3) is 0
    for (const p of LEVELS) expect(gapCount(4, p)).toBe(gapCount(2, p));
    expect(gapClosedForm(8).text).toBe('∏(q−2) − 2·∏(q−3) + ∏(q−4)'); // OEIS A271565, from 5
    expect(gapClosedForm(10).text).toBe('4·∏(q−2) − 6·∏(q−3) + 2·∏(q−4)'); // OEIS A285298, from 7
  });
  it('n2, n4, n6, n8, n10 from the closed forms equal enumeration at every level ≤ 23# where they hold', () => {
    for (const g of [2, 4, 6, 8, 10]) {
      const form = gapClosedForm(g);
      for (const p of LEVELS.filter((q) => q >= form.validFrom)) expect(evaluateClosedForm(form, p)).toBe(hist(p).get(g) ?? 0n);
    }
  });
  it('every gap count g ≤ 60 equals enumeration at every level ≤ 23# (closed form or small-level path)', () => {
    for (const p of LEVELS) {
      const h = hist(p);
      for (let g = 2; g <= 60; g += 2) expect(gapCount(g, p)).toBe(h.get(g) ?? 0n);
    }
  });
  it('published values: n2 (A059861), n6 (A271564) at 5# … 23#', () => {
    // (from memory) OEIS A059861: 1, 3, 15, 135, 1485, 22275, 378675, 7952175 — re-derived above by enumeration
    expect([5, 7, 11, 13, 17, 19, 23].map((p) => gapCount(2, p))).toEqual([3n, 15n, 135n, 1485n, 22275n, 378675n, 7952175n]);
    // (from memory) OEIS A271564: 2, 14, 142, 1690, 26630, 470630, 10169950
    expect([5, 7, 11, 13, 17, 19, 23].map((p) => gapCount(6, p))).toEqual([2n, 14n, 142n, 1690n, 26630n, 470630n, 10169950n]);
  });
  it('closed-form and enumerated counts agree for random admissible patterns at levels ≤ 19# (fast-check)', () => {
    const level = fc.constantFrom(5, 7, 11, 13, 17, 19);
    const pattern = fc.array(fc.integer({ min: 1, max: 9 }).map((h) => 2 * h), { minLength: 1, maxLength: 4 });
    fc.assert(
      fc.property(pattern.filter((gs) => isAdmissible(partialSums(gs))), level, (gs, p) => {
        expect(patternCount(gs, p)).toBe(enumeratedPatternCount(gs, p));
      }),
      { numRuns: 150 },
    );
  });
  it('long patterns at small levels (below the closed form range) by the restricted inclusion–exclusion', () => {
    for (const gs of [[6, 4, 2, 4, 2, 4, 6, 2], [10, 2, 4, 2, 4, 6, 2, 6], [2, 10, 2], [22, 2, 4, 2]]) {
      for (const p of [3, 5, 7, 11, 13, 17]) expect(patternCount(gs, p)).toBe(enumeratedPatternCount(gs, p));
    }
    // spans above 60 at levels ≤ 13 walk the cycle; at 17 and 19 the restricted search runs
    const long = [6, 4, 2, 4, 2, 4, 6, 2, 6, 4, 2, 4, 2, 4, 6, 2];
    for (const p of [7, 11, 13, 17, 19]) expect(patternCount(long, p)).toBe(enumeratedPatternCount(long, p));
  });
  it('odd gaps never occur, bad patterns are refused', () => {
    expect(patternCount([3], 7)).toBe(0n);
    expect(patternClosedForm([2, 3]).text).toBe('0');
    expect(() => patternCount([0], 7)).toThrow(EngineError);
    expect(() => patternCount([], 7)).toThrow(/at least one gap/);
    expect(() => gapCount(122, 7)).toThrow(/span 122/);
    expect(() => evaluateClosedForm(gapClosedForm(30), 5)).toThrow(/p ≥ 13/);
  });
});

describe('histograms from counts alone', () => {
  it('equal the enumerated histograms at every level 3 … 23', () => {
    for (const p of LEVELS) expect(histogramByCounts(p)).toEqual(hist(p));
  });
  it('equal the histogram recursion at 29# and 31# (two code paths; 37# against the split route in split-counts.test.ts)', () => {
    for (const p of [29, 31]) expect(histogramByCounts(p)).toEqual(gapHistogram(p));
  });
  it('sum to φ(p#) and p# at 37# (largest gap 66)', () => {
    const h = histogramByCounts(37);
    let n = 0n;
    let len = 0n;
    for (const [g, v] of h) {
      n += v;
      len += BigInt(g) * v;
    }
    expect([n, len]).toEqual([primorialTotient(37), primorial(37)]);
    expect(Math.max(...h.keys())).toBe(66);
  });
});

function partialSums(gs: number[]): number[] {
  const out = [0];
  for (const g of gs) out.push(out[out.length - 1]! + g);
  return out;
}
