import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { narrowAdmissibility } from './narrow-admissibility';

describe('narrowAdmissibility', () => {
  it('accepts the prime quadruplet pattern {0, 2, 6, 8} with the least uncovered classes', () => {
    // 0,2,6,8 mod 2 = {0}; mod 3 = {0, 2}: witness 1 mod 2 and 1 mod 3 (hand computation).
    expect(narrowAdmissibility([0, 2, 6, 8])).toEqual({ admissible: true, witness: { 2: 1, 3: 1 } });
  });
  it('rejects {0, 2, 4}: every class modulo 3 is covered', () => {
    expect(narrowAdmissibility([0, 2, 4])).toEqual({ admissible: false, prime: 3, covered: [0, 1, 2] });
  });
  it('rejects {0, 1}: both parities', () => {
    expect(narrowAdmissibility([1, 0])).toMatchObject({ admissible: false, prime: 2 });
  });
  it('handles negative elements and any order', () => {
    expect(narrowAdmissibility([8, -2, 2, 0])).toEqual({ admissible: false, prime: 3, covered: [0, 1, 2] });
    expect(narrowAdmissibility([-1, 1])).toEqual({ admissible: true, witness: { 2: 0 } });
  });
  it('a single element and the empty set are admissible', () => {
    expect(narrowAdmissibility([5])).toEqual({ admissible: true, witness: {} });
    expect(narrowAdmissibility([])).toEqual({ admissible: true, witness: {} });
  });
  it('rejects repeated or non-integer elements', () => {
    expect(() => narrowAdmissibility([0, 2, 2])).toThrow(EngineError);
    expect(() => narrowAdmissibility([0, 1.5])).toThrow(EngineError);
  });
});
