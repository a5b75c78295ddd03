import { inputError } from '../errors';
import { primesUpTo } from '../primes';
import type { ResidueWitness } from './types';

/** Result of {@link narrowAdmissibility}: a witness, or the first prime whose classes are all covered. */
export type NarrowAdmissibility =
  | { readonly admissible: true; readonly witness: ResidueWitness }
  | { readonly admissible: false; readonly prime: number; readonly covered: readonly number[] };

const MEMBER_BITMAP_LIMIT = 1 << 26;

/**
 * The least residue r in [0, q) whose class holds no element (element x ↔ member[x − base]), or −1
 * when the probes exceed `budget` before one is found (the caller then walks all residues).
 */
function probeFreeClass(member: Uint8Array, span: number, base: number, q: number, budget: number): number {
  let probes = 0;
  let start = (((0 - base) % q) + q) % q; // offset of the first integer ≡ 0 (mod q) in the span
  for (let r = 0; r < q; r++) {
    let hit = false;
    for (let i = start; i <= span; i += q) {
      probes++;
      if (member[i]) {
        hit = true;
        break;
      }
    }
    if (!hit) return r;
    if (probes > budget) return -1;
    if (++start === q) start = 0;
  }
  return -1;
}

/** Largest tuple size accepted by the narrow-tuple code (memory: one bitmap of q bytes per prime q ≤ k). */
export const NARROW_MAX_K = 1_000_000;

/**
 * Admissibility of a set of distinct safe integers (any order, negatives allowed): for every prime
 * q ≤ k some residue class modulo q contains no element. Only primes q ≤ k can be fully covered.
 * The witness gives, for each prime q ≤ k, the smallest uncovered residue in [0, q).
 * Cost O(k·π(k)) with one occupancy bitmap per prime; stops at the first covered prime.
 * This is the narrow-tuple module's own check, kept independent of the tuple module on purpose
 * (tests compare the two code paths).
 * @throws EngineError(input) when an element is not a safe integer, elements repeat, or k > 10^6.
 */
export function narrowAdmissibility(elements: readonly number[]): NarrowAdmissibility {
  const k = elements.length;
  if (k > NARROW_MAX_K) throw inputError(`tuple of ${k} elements: at most ${NARROW_MAX_K} allowed`);
  for (const h of elements) {
    if (!Number.isSafeInteger(h)) throw inputError(`tuple element ${h} is not a safe integer`);
  }
  if (new Set(elements).size !== k) throw inputError('tuple elements must be distinct');
  const witness: ResidueWitness = {};
  if (k === 0) return { admissible: true, witness };
  // Sorted, then residues walk along the gaps: r ← r + gap (mod q) needs no division when gap < q.
  const sorted = Float64Array.from(elements).sort();
  const gaps = new Float64Array(k);
  for (let i = 1; i < k; i++) gaps[i] = sorted[i] - sorted[i - 1];
  const seen = new Int32Array(k + 1).fill(-1);
  // Membership bitmap over [min, max]: a class r is free when no element of the class lies in
  // the span, found by probing r, r + q, … (span/q probes). Free classes are plentiful for most q,
  // so this beats marking all k residues; the walk below is the fallback when probing drags on.
  const base = sorted[0];
  const span = sorted[k - 1] - base;
  const member = span < MEMBER_BITMAP_LIMIT ? new Uint8Array(span + 1) : null;
  if (member) for (let i = 0; i < k; i++) member[sorted[i] - base] = 1;
  for (const q of primesUpTo(k)) {
    if (member) {
      const free = probeFreeClass(member, span, base, q, k);
      if (free >= 0) {
        witness[q] = free;
        continue;
      }
    }
    let r = sorted[0] % q;
    if (r < 0) r += q;
    let covered = 0;
    for (let i = 0; i < k; i++) {
      const g = gaps[i];
      r += g < q ? g : g % q;
      if (r >= q) r -= q;
      if (seen[r] !== q) {
        seen[r] = q;
        if (++covered === q) break;
      }
    }
    if (covered === q) {
      return { admissible: false, prime: q, covered: Array.from({ length: q }, (_, c) => c) };
    }
    let free = 0;
    while (seen[free] === q) free++;
    witness[q] = free;
  }
  return { admissible: true, witness };
}
