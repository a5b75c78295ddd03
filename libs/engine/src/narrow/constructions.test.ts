import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { admissibility } from '../tuple';
import { greedyGreedySieve } from './greedy-greedy';
import { hensleyRichardsTuple } from './hensley-richards';
import { improveTuple } from './improve-tuple';
import { minimalDiameter } from './minimal-diameter';
import { sieveInterval } from './interval-sieve';
import { narrowAdmissibility } from './narrow-admissibility';
import { narrowTuple } from './narrow-tuple';
import { schinzelSieveTuple } from './schinzel-sieve';

describe('greedy-greedy sieve', () => {
  // Polymath8 narrow-tuple records (2013): greedy-greedy sieving of [−185662, 202456] leaves
  // 34 429 survivors, an admissible tuple of diameter 388 118. Rule reproduced here: remove 1 mod 2
  // and 0 mod q for odd q ≤ 137 (any bound from 137 to at least 397 gives the same set), then the
  // least occupied class (smallest residue on ties) for each larger prime until admissible.
  it('reproduces the 34 429-tuple of diameter 388 118', () => {
    const r = greedyGreedySieve({ from: -185662, to: 202456, fixedBound: 137 });
    expect(r.k).toBe(34429);
    expect(r.diameter).toBe(388118);
    expect(r.origin).toBe(-185662);
    expect(r.method).toBe('greedy-greedy');
    // Independent checks: this module on the unshifted survivors, the tuple module on the tuple.
    const survivors = r.tuple.map((h) => h + r.origin);
    expect(narrowAdmissibility(survivors).admissible).toBe(true);
    const theirs = admissibility(r.tuple);
    expect(theirs).toMatchObject({ admissible: true, k: 34429, diameter: 388118 });
    if (theirs.admissible) expect(theirs.witness).toEqual(r.witness);
  });

  it('a fixed bound below 137 leaves a different set (so the rule is pinned down)', () => {
    const r = sieveInterval({ from: -185662, to: 202456, fixedBound: 131 });
    expect(r.survivors.length).not.toBe(34429);
  });

  it('the greedy phase removes the least occupied class', () => {
    // [0, 30] minus odds: 0..30 even (16 numbers); mod 3 classes of evens have 6, 5, 5 members
    // (0: 0,6,…,30; 1: 4,10,…,28; 2: 2,8,…,26): the least occupied, smallest residue is 1.
    const r = sieveInterval({ from: 0, to: 30, greedyUpTo: 3 });
    expect(r.removed[3]).toBe(1);
    expect(r.survivors).toEqual([0, 2, 6, 8, 12, 14, 18, 20, 24, 26, 30]);
  });
});

describe('constructions for large k', () => {
  it.each([50, 200, 1000])('Hensley–Richards, Schinzel and the best tuple are admissible for k = %i', (k) => {
    for (const r of [hensleyRichardsTuple(k), schinzelSieveTuple(k), narrowTuple(k)]) {
      expect(r.k).toBe(k);
      expect(r.tuple[0]).toBe(0);
      expect(r.tuple[k - 1]).toBe(r.diameter);
      expect(narrowAdmissibility(r.tuple).admissible).toBe(true);
    }
  });

  it('the Hensley–Richards tuple for k = 10 is ±1 and ± the primes from p_{m+1} on', () => {
    const r = hensleyRichardsTuple(10);
    const half = r.tuple.map((h) => h - r.diameter / 2);
    expect(half).toContain(1);
    expect(half).toContain(-1);
    expect(half.filter((h) => Math.abs(h) > 1).every((h) => isPrime(Math.abs(h)))).toBe(true);
  });

  it('the best construction for k = 1000 beats Hensley–Richards', () => {
    const best = narrowTuple(1000);
    expect(best.exact).toBe(false);
    expect(best.diameter).toBeLessThan(hensleyRichardsTuple(1000).diameter);
  });

  it('local improvement never widens and keeps admissibility', () => {
    const start = schinzelSieveTuple(300);
    const better = improveTuple(start.tuple);
    expect(better.k).toBe(300);
    expect(better.diameter).toBeLessThanOrEqual(start.diameter);
    expect(narrowAdmissibility(better.tuple).admissible).toBe(true);
  });

  it('local improvement narrows a loose 5-tuple', () => {
    // {0, 2, 8, 12, 20} is admissible (mod 3 misses 1, mod 5 misses 1); H(5) = 12 (OEIS A008407).
    const r = improveTuple([0, 2, 8, 12, 20]);
    expect(r.diameter).toBeLessThan(20);
    expect(r.diameter).toBeGreaterThanOrEqual(12);
    expect(narrowAdmissibility(r.tuple).admissible).toBe(true);
  });

  it('no construction beats the exact H(k) (k = 20 … 60, two code paths)', () => {
    for (const k of [20, 33, 47, 60]) {
      const h = minimalDiameter(k).diameter;
      expect(hensleyRichardsTuple(k).diameter).toBeGreaterThanOrEqual(h);
      expect(schinzelSieveTuple(k).diameter).toBeGreaterThanOrEqual(h);
      const greedy = greedyGreedySieve({ from: 0, to: 6 * h, fixedBound: 0, k });
      expect(greedy.method).toBe('greedy');
      expect(greedy.diameter).toBeGreaterThanOrEqual(h);
      expect(improveTuple(greedy.tuple).diameter).toBeGreaterThanOrEqual(h);
    }
  });

  it('refuses work above the limits with EngineError', () => {
    expect(() => sieveInterval({ from: 0, to: 3_000_000, fixedBound: 3 })).toThrow(/above the limit/);
    expect(() => narrowTuple(50_001)).toThrow(EngineError);
    expect(() => hensleyRichardsTuple(0)).toThrow(EngineError);
    expect(() => sieveInterval({ from: 5, to: 4 })).toThrow(EngineError);
  });

  it('narrowTuple is exact up to k = 100', () => {
    expect(narrowTuple(20)).toMatchObject({ k: 20, diameter: 80, exact: true });
  });
});

function isPrime(n: number): boolean {
  if (n < 2) return false;
  for (let d = 2; d * d <= n; d++) if (n % d === 0) return false;
  return true;
}
