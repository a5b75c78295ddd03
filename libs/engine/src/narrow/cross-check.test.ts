import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { admissibility } from '../tuple';
import { minimalDiameter } from './minimal-diameter';
import { narrowAdmissibility } from './narrow-admissibility';

// Two independent code paths: this module's narrowAdmissibility and the tuple module's admissibility.
describe('narrowAdmissibility agrees with the tuple module', () => {
  it('on random tuples (verdict, witness of the shifted tuple, obstruction)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: -400, max: 400 }), { minLength: 1, maxLength: 40 }), (values) => {
        const mine = narrowAdmissibility(values);
        const theirs = admissibility(values);
        expect(mine.admissible).toBe(theirs.admissible);
        if (mine.admissible && theirs.admissible) {
          // Their witness refers to the tuple shifted to start at 0; ours to the values as given.
          const base = Math.min(...values);
          const shifted = narrowAdmissibility(values.map((v) => v - base));
          expect(shifted).toEqual({ admissible: true, witness: theirs.witness });
        } else if (!mine.admissible && !theirs.admissible) {
          expect(mine.prime).toBe(theirs.obstruction.prime);
          expect(mine.covered).toEqual(theirs.obstruction.covered);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('on dense random even tuples, which are often admissible', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 0, max: 60 }), { minLength: 5, maxLength: 14 }), (halves) => {
        const values = halves.map((h) => 2 * h);
        expect(narrowAdmissibility(values).admissible).toBe(admissibility(values).admissible);
      }),
      { numRuns: 300 },
    );
  });

  it('on the exhaustive-search results for k ≤ 30', () => {
    for (let k = 1; k <= 30; k++) {
      const r = minimalDiameter(k);
      const theirs = admissibility(r.tuple);
      expect(theirs.admissible).toBe(true);
      expect(theirs.diameter).toBe(r.diameter);
      if (theirs.admissible) expect(theirs.witness).toEqual(r.witness);
    }
  });
  // The greedy-greedy 34 429-tuple is compared in constructions.test.ts (one sieve run per suite).
});
