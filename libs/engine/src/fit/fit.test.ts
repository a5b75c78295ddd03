import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { cycleHistogramAndPairSums } from '../wheel/scan';
import { wheelGaps } from '../wheel/level-gaps';
import { gapHistogram } from '../wheel/level';
import { fitProductBasis, productBasisValue, rational, ratAdd, ratDiv, ratToString, solveRational, type LevelValue } from './index';

const enumerated = (g: number, levels: number[]): LevelValue[] =>
  levels.map((p) => ({ level: p, value: (p <= 23 ? cycleHistogramAndPairSums(wheelGaps(p)).histogram : gapHistogram(p)).get(g) ?? 0n }));

describe('rationals', () => {
  it('reduce and compute exactly', () => {
    expect(rational(6n, -4n)).toEqual({ num: -3n, den: 2n });
    expect(ratToString(ratAdd(rational(1n, 3n), rational(1n, 6n)))).toBe('1/2');
    expect(() => ratDiv(rational(1n), rational(0n))).toThrow(EngineError);
    const x = solveRational([[rational(2n), rational(1n)], [rational(1n), rational(3n)]], [rational(3n), rational(5n)]);
    expect(x.map(ratToString)).toEqual(['4/5', '7/5']);
    expect(() => solveRational([[rational(1n), rational(2n)], [rational(2n), rational(4n)]], [rational(1n), rational(2n)])).toThrow(/singular/);
  });
});

describe('basis fit', () => {
  it('recovers n6 = 2·∏(q−2) − 2·∏(q−3) from enumerated counts and confirms it to 31# (OEIS A271564)', () => {
    const r = fitProductBasis(enumerated(6, [5, 7, 11, 13, 17, 19, 23, 29, 31]), { from: 5, shifts: [2, 3] });
    expect(r.text).toBe('2·∏(q−2) − 2·∏(q−3)');
    expect(r.integral).toBe(true);
    expect(r.fittedLevels).toEqual([5, 7]);
    expect(r.holdsAt).toEqual([5, 7, 11, 13, 17, 19, 23, 29, 31]);
    expect(r.firstFailure).toBeNull();
  });
  it('recovers n10 = 4·∏(q−2) − 6·∏(q−3) + 2·∏(q−4) on primes from 7 (OEIS A285298)', () => {
    const r = fitProductBasis(enumerated(10, [7, 11, 13, 17, 19, 23]), { from: 7, shifts: [2, 3, 4] });
    expect(r.text).toBe('4·∏(q−2) − 6·∏(q−3) + 2·∏(q−4)');
    expect(r.checks.map((c) => c.holds)).toEqual([true, true, true]);
  });
  it('says where a too small basis fails', () => {
    const r = fitProductBasis(enumerated(6, [5, 7, 11, 13]), { from: 5, shifts: [2] });
    expect(r.text).toBe('(2/3)·∏(q−2)');
    expect(r.firstFailure).toBe(7);
    expect(r.checks[0]).toMatchObject({ level: 7, value: 14n, holds: false });
    expect(ratToString(r.checks[0]!.predicted)).toBe('10');
  });
  it('refuses bad series and bases', () => {
    const s = enumerated(6, [5, 7]);
    expect(() => fitProductBasis(s, { from: 5, shifts: [2, 3, 4] })).toThrow(/at least 3 values/);
    expect(() => fitProductBasis([s[1]!, s[0]!], { from: 5, shifts: [2] })).toThrow(/levels must increase/);
    expect(() => fitProductBasis(s, { from: 6, shifts: [2] })).toThrow(/not a prime/);
    expect(() => fitProductBasis(s, { from: 5, shifts: [2, 2] })).toThrow(/repeat/);
    // below the start of the products every basis value is the empty product 1: singular
    expect(() => fitProductBasis(enumerated(6, [2, 3]), { from: 5, shifts: [2, 3] })).toThrow(/singular/);
  });
  it('evaluates basis products with the empty-product convention', () => {
    expect(productBasisValue(5, 2, 3)).toBe(1n);
    expect(productBasisValue(5, 2, 11)).toBe(3n * 5n * 9n);
  });
});
