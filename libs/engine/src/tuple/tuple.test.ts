import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { EngineError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { admissibility, coveredResidues, isAdmissible, normalizeTuple, occupancy, parseTuple, tupleDiameter } from './index';

/** Independent admissibility check: a set per prime (slow, for small tuples). */
function bruteAdmissible(h: number[]): boolean {
  for (const q of primesUpTo(h.length)) {
    const s = new Set(h.map((x) => ((x % q) + q) % q));
    if (s.size === q) return false;
  }
  return true;
}

describe('normalizeTuple / parseTuple', () => {
  it('sorts and shifts to start at 0, any order on input', () => {
    expect(normalizeTuple([12, 2, 8, 0, 6])).toEqual([0, 2, 6, 8, 12]);
    expect(normalizeTuple([-3, 5, 1])).toEqual([0, 4, 8]);
    expect(normalizeTuple([10n, '14', 12])).toEqual([0, 2, 4]);
    expect(tupleDiameter([0, 2, 6, 8, 12])).toBe(12);
  });
  it('parses text with commas, spaces, new lines, blank and # lines', () => {
    expect(parseTuple('# a comment\n12\n\n 0, 2 6\n8\n')).toEqual([0, 2, 6, 8, 12]);
  });
  it.each([
    [[0, 2, 2], /duplicate offset 2/],
    [[0, 1.5], /not an integer/],
    [[0, 2 ** 53], /2\^53/],
    [[-(2 ** 52), 2 ** 52], /diameter/],
    [['0', 'x'], /"x"/],
    [[], /at least one/],
  ])('refuses %j', (input, message) => {
    expect(() => normalizeTuple(input as number[])).toThrow(EngineError);
    expect(() => normalizeTuple(input as number[])).toThrow(message);
  });
});

describe('occupancy', () => {
  it('counts residues met modulo a prime', () => {
    expect(coveredResidues([0, 2, 6, 8, 12], 3)).toEqual([0, 2]);
    expect(occupancy([0, 2, 6, 8, 12], 5)).toBe(4);
    expect(occupancy([0, 2, 6, 8, 12], 7)).toBe(5);
    expect(coveredResidues([-1, 3], 5)).toEqual([3, 4]);
  });
  it('refuses a modulus that is not prime', () => {
    expect(() => occupancy([0, 2], 9)).toThrow(/modulus 9 is not a prime/);
  });
});

describe('admissibility', () => {
  it('gives a witness for every prime q ≤ k of an admissible tuple', () => {
    const v = admissibility([0, 2, 6, 8, 12]);
    expect(v).toEqual({ admissible: true, k: 5, diameter: 12, witness: { 2: 1, 3: 1, 5: 4 } }); // residues mod 5: 0,2,1,3,2
  });
  it('names the obstruction of a non-admissible tuple', () => {
    const v = admissibility([4, 0, 2]);
    expect(v).toEqual({ admissible: false, k: 3, diameter: 4, obstruction: { prime: 3, covered: [0, 1, 2] } });
    expect(isAdmissible([0, 2, 6, 8, 12, 14])).toBe(false); // covers 0…4 mod 5
    expect(admissibility([0, 2, 6, 8, 12, 14])).toMatchObject({ obstruction: { prime: 5 } });
  });
  it('handles huge diameters without a bitmap (offsets up to 2^53 − 1)', () => {
    // 2^40 ≡ 1 (mod 3): {0, 2, 2^40} meets 0, 2, 1 mod 3; 2^40 + 2 ≡ 0 leaves class 1 free
    expect(admissibility([0, 2, 2 ** 40])).toMatchObject({ admissible: false, obstruction: { prime: 3, covered: [0, 1, 2] } });
    expect(admissibility([0, 2, 2 ** 40 + 2])).toEqual({ admissible: true, k: 3, diameter: 2 ** 40 + 2, witness: { 2: 1, 3: 1 } });
    expect(admissibility([-(2 ** 52), 2 ** 52 - 1, 7]).diameter).toBe(2 ** 53 - 1);
  });
  it('agrees with a brute-force check on random tuples (fast-check)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: -60, max: 60 }), { minLength: 1, maxLength: 14 }), (xs) => {
        const v = admissibility(xs);
        const h = normalizeTuple(xs);
        expect(v.admissible).toBe(bruteAdmissible(h));
        if (v.admissible) {
          for (const [q, w] of Object.entries(v.witness)) expect(coveredResidues(h, Number(q))).not.toContain(w);
        } else {
          expect(coveredResidues(h, v.obstruction.prime)).toHaveLength(v.obstruction.prime);
        }
      }),
      { numRuns: 300 },
    );
  });
  it('decides a 34 429-tuple of consecutive primes above 34 429 (admissible: no member is 0 mod q ≤ k)', () => {
    // Every prime q ≤ k misses the class of 0 (all members are primes > k), so the tuple is admissible
    // and the witness of q is the least class missed after the shift by the first member.
    const k = 34_429;
    const primes = primesUpTo(500_000);
    const start = primes.findIndex((p) => p > k);
    const tuple = Array.from(primes.subarray(start, start + k));
    expect(tuple).toHaveLength(k);
    const v = admissibility(tuple);
    expect(v.admissible).toBe(true);
    if (!v.admissible) return;
    const shift = tuple[0]!;
    for (const q of [2, 3, 5, 7, 97, 34_403]) {
      const w = v.witness[q]!;
      expect(tuple.every((x) => (x - shift - w) % q !== 0)).toBe(true);
      expect(w).toBeLessThanOrEqual(((-shift % q) + q) % q); // the class of −shift is free
    }
    // one even member among odd primes meets both classes mod 2
    const blocked = admissibility([...tuple, 600_000]);
    expect(blocked).toMatchObject({ admissible: false, k: k + 1, obstruction: { prime: 2, covered: [0, 1] } });
  });
});
