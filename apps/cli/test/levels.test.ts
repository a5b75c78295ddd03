import { describe, expect, it } from 'vitest';
import { cribra, cribraJson, expectUsageError } from './run-cli';

describe('cribra wheel', () => {
  it('level 13: 13# = 30030 (OEIS A002110), φ = 5760 (OEIS A005867), largest gap 22 (OEIS A048670)', () => {
    const r = cribraJson('wheel', '--level', '13');
    expect(r).toMatchObject({ prime: 13, modulus: '30030', members: '5760', maxGap: 22 });
    const h = r.histogram as Record<string, string>;
    // Σ n_g = φ(p#) and Σ g·n_g = p# over one period.
    expect(Object.values(h).reduce((s, v) => s + BigInt(v), 0n)).toBe(5760n);
    expect(Object.entries(h).reduce((s, [g, v]) => s + BigInt(g) * BigInt(v), 0n)).toBe(30030n);
  });
  it('groups digits with thin spaces in the readable form', () => {
    expect(cribra('wheel', '--level', '13').stdout).toContain('30\u2009030');
  });
  it('says which route made the histogram; every route gives the enumerated histogram of level 13', () => {
    const enumerated = cribraJson('wheel', '--level', '13');
    expect(enumerated.route).toBe('enumerated');
    for (const route of ['recursion', 'split', 'closed-form']) {
      const r = cribraJson('wheel', '--level', '13', '--route', route);
      expect(r.route).toBe(route);
      expect(r.histogram).toEqual(enumerated.histogram);
    }
  });
  it('level 41 by the split route (default from 37): largest gap 74 (OEIS A048670), identities hold', () => {
    const r = cribraJson('wheel', '--level', '41', '--workers', '2');
    // 41# = 304250263527210 (OEIS A002110), φ(41#) = 44144787456000 (OEIS A005867)
    expect(r).toMatchObject({ prime: 41, modulus: '304250263527210', members: '44144787456000', maxGap: 74, route: 'split' });
    const h = r.histogram as Record<string, string>;
    expect(Object.values(h).reduce((s, v) => s + BigInt(v), 0n)).toBe(44144787456000n);
    expect(Object.entries(h).reduce((s, [g, v]) => s + BigInt(g) * BigInt(v), 0n)).toBe(304250263527210n);
    // n2 = ∏_{3 ≤ q ≤ 41}(q − 2) (OEIS A059861): the closed form of the twin gap, a second path
    expect(h['2']).toBe([3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41].reduce((s, q) => s * BigInt(q - 2), 1n).toString());
  });
  it('refuses a route that cannot reach the level, and unknown routes', () => {
    expectUsageError(cribra('wheel', '--level', '29', '--route', 'enumerated'), /levels ≤ 23/);
    expectUsageError(cribra('wheel', '--level', '41', '--route', 'recursion'), /level 37 at most/);
    expectUsageError(cribra('wheel', '--level', '5', '--route', 'split'), /7 or more/);
    expectUsageError(cribra('wheel', '--level', '13', '--route', 'guess'), /--route must be one of enumerated, recursion, split, closed-form/);
  });
  it.each([['9', /not a prime/], ['53', /--level/], ['1e1.5', /not an integer/]])('rejects --level %s', (level, msg) => {
    expectUsageError(cribra('wheel', '--level', level), msg);
  });
  it('rejects --workers 0', () => {
    expectUsageError(cribra('wheel', '--level', '7', '--workers', '0'), /--workers/);
  });
});

describe('cribra occurrences', () => {
  it('twins at level 31: ∏_{3 ≤ q ≤ 31} (q − 2) (Chinese remainder theorem)', () => {
    const expected = [3, 5, 7, 11, 13, 17, 19, 23, 29, 31].reduce((s, q) => s * BigInt(q - 2), 1n);
    expect(cribraJson('occurrences', '--pattern', '0,2', '--level', '31')).toEqual({
      pattern: [0, 2],
      level: 31,
      count: expected.toString(),
    });
  });
  it('a non-admissible pattern occurs 0 times', () => {
    expect(cribraJson('occurrences', '--pattern', '0,2,4', '--level', '7').count).toBe('0');
  });
  it('rejects a level that is not a prime and a duplicate offset', () => {
    expectUsageError(cribra('occurrences', '--pattern', '0,2', '--level', '33'), /not a prime/);
    expectUsageError(cribra('occurrences', '--pattern', '0,2,0', '--level', '7'), /duplicate offset 0/);
  });
});

describe('cribra gapcount', () => {
  it('agrees with the enumerated histogram of level 13 for every gap (two code paths)', () => {
    const h = cribraJson('wheel', '--level', '13').histogram as Record<string, string>;
    for (const g of [2, 4, 6, 8, 10, 12, 14, 16, 18, 20, 22]) {
      const r = cribraJson('gapcount', '--gap', String(g), '--level', '13');
      expect(r.count).toBe(h[String(g)] ?? '0');
    }
  });
  it('gives the closed form n2 = ∏(q − 2) (OEIS A059861)', () => {
    const r = cribraJson('gapcount', '--gap', '2', '--level', '37');
    expect(r.closedForm).toBe('∏(q−2)');
    expect(r.count).toBe([3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37].reduce((s, q) => s * BigInt(q - 2), 1n).toString());
  });
  it('rejects a gap above the limit', () => {
    expectUsageError(cribra('gapcount', '--gap', '1000', '--level', '13'), /--gap/);
  });
});
