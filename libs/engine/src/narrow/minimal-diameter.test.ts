import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { minimalDiameter, tupleOfDiameter } from './minimal-diameter';
import { narrowAdmissibility } from './narrow-admissibility';

// H(k) for k = 1..56: OEIS A008407 (offset 2; a(1) = 0 stated in its comments).
const A008407 = [
  0, 2, 6, 8, 12, 16, 20, 26, 30, 32, 36, 42, 48, 50, 56, 60, 66, 70, 76, 80, 84, 90, 94, 100, 110, 114, 120, 126,
  130, 136, 140, 146, 152, 156, 158, 162, 168, 176, 182, 186, 188, 196, 200, 210, 212, 216, 226, 236, 240, 246, 252,
  254, 264, 270, 272, 278,
];

/** Brute force, an independent path: DFS over even offsets 0 < h ≤ d, admissibility checked at the end. */
function bruteForceH(k: number): number {
  for (let d = 2 * (k - 1); ; d += 2) {
    const chosen: number[] = [0];
    const dfs = (next: number): boolean => {
      if (chosen.length === k - 1) {
        chosen.push(d);
        const ok = narrowAdmissibility(chosen).admissible;
        chosen.pop();
        return ok;
      }
      for (let h = next; h < d; h += 2) {
        chosen.push(h);
        if (dfs(h + 2)) return true;
        chosen.pop();
      }
      return false;
    };
    if (k === 1 ? true : dfs(2)) return k === 1 ? 0 : d;
  }
}

describe('minimalDiameter', () => {
  it.each(A008407.map((h, i) => [i + 1, h]))('H(%i) = %i (OEIS A008407)', (k, h) => {
    const r = minimalDiameter(k);
    expect(r.diameter).toBe(h);
    expect(r.tuple).toHaveLength(k);
    expect(r.tuple[0]).toBe(0);
    expect(r.tuple[k - 1]).toBe(h);
    const check = narrowAdmissibility(r.tuple);
    expect(check.admissible).toBe(true);
    expect(r.witness).toEqual((check as { witness: unknown }).witness);
  });

  it('agrees with a brute-force search for k ≤ 9', () => {
    for (let k = 1; k <= 9; k++) expect(minimalDiameter(k).diameter).toBe(bruteForceH(k));
  });

  it('finds no tuple one step below H(k) and one at H(k), for k = 20 and 25', () => {
    expect(tupleOfDiameter(20, 78)).toBeNull();
    expect(tupleOfDiameter(20, 80)).not.toBeNull();
    expect(tupleOfDiameter(25, 108)).toBeNull();
    expect(tupleOfDiameter(25, 110)).not.toBeNull();
  });

  it('the witness of every residue leaves its class empty', () => {
    const r = minimalDiameter(25);
    for (const [q, res] of Object.entries(r.witness)) {
      for (const h of r.tuple) expect(((h % Number(q)) + Number(q)) % Number(q)).not.toBe(res);
    }
    expect(Object.keys(r.witness).map(Number)).toEqual([2, 3, 5, 7, 11, 13, 17, 19, 23]);
  });

  it.each([0, -3, 2.5, 101, Number.NaN])('rejects k = %s', (k) => {
    expect(() => minimalDiameter(k)).toThrow(EngineError);
  });
});
