import { primesUpTo } from '../primes/small-primes';
import { normalizeTuple } from './normalize';

/** An admissible tuple: for every prime q ≤ k, `witness[q]` is the least residue mod q that H misses. */
export interface AdmissibleVerdict {
  readonly admissible: true;
  readonly k: number;
  readonly diameter: number;
  readonly witness: Readonly<Record<number, number>>;
}

/** A non-admissible tuple: the least prime q whose residues are all covered (they are 0 … q−1). */
export interface ObstructedVerdict {
  readonly admissible: false;
  readonly k: number;
  readonly diameter: number;
  readonly obstruction: { readonly prime: number; readonly covered: readonly number[] };
}

export type Admissibility = AdmissibleVerdict | ObstructedVerdict;

/**
 * Decides admissibility of H = {h_1, …, h_k}: H is admissible when for every prime q it misses at
 * least one residue class mod q. Only primes q ≤ k can be fully covered, so exactly those are tested;
 * the witness maps each of them to the least uncovered residue (of the normalized tuple, which starts
 * at 0). Cost O(k·π(k)) with one occupancy stamp per prime and residues advanced by differences
 * (no division in the inner loop); k = 10^5 takes well under a second.
 * Input in any order; it is normalized first ({@link normalizeTuple}).
 * @throws EngineError(input) for an invalid tuple (see {@link normalizeTuple}).
 */
export function admissibility(values: ReadonlyArray<number | bigint | string>): Admissibility {
  const h = normalizeTuple(values);
  const k = h.length;
  const diameter = h[k - 1]!;
  const primes = primesUpTo(k);
  const witness: Record<number, number> = {};
  if (primes.length === 0) return { admissible: true, k, diameter, witness };
  const stamp = new Int32Array(primes[primes.length - 1]! + 1);
  // Residues advance by the differences of consecutive offsets: no division in the inner loop.
  // Integer arithmetic when the diameter fits 31 bits (always, in practice), doubles otherwise.
  const small = diameter < 2 ** 31;
  const diffs = small ? new Int32Array(k) : new Float64Array(k);
  for (let i = 1; i < k; i++) diffs[i] = h[i]! - h[i - 1]!;
  // A membership bitmap lets a prime q be settled by probing candidate residues w = 0, 1, …:
  // w is free when none of w, w + q, w + 2q, … ≤ diameter is in H (diameter/q probes). For large q
  // free residues abound, so this is far cheaper than marking all k offsets; a probe budget of k
  // per prime falls back to marking when residues are nearly all covered.
  const member = diameter <= BITMAP_LIMIT ? new Uint8Array(diameter + 1) : null;
  if (member) for (const x of h) member[x] = 1;
  for (let pi = 0; pi < primes.length; pi++) {
    const q = primes[pi]!;
    if (member) {
      const w = probeFree(member, q, k);
      if (w >= 0) {
        witness[q] = w;
        continue;
      }
    }
    const mark = pi + 1;
    const covered = small ? markInt(diffs as Int32Array, q, stamp, mark) : markFloat(diffs as Float64Array, q, stamp, mark);
    if (covered === q) {
      const all = Array.from({ length: q }, (_, j) => j);
      return { admissible: false, k, diameter, obstruction: { prime: q, covered: all } };
    }
    let w = 0;
    while (stamp[w] === mark) w++;
    witness[q] = w;
  }
  return { admissible: true, k, diameter, witness };
}

/** True when the tuple is admissible (see {@link admissibility}). @throws EngineError(input) for an invalid tuple. */
export function isAdmissible(values: ReadonlyArray<number | bigint | string>): boolean {
  return admissibility(values).admissible;
}

/** Largest diameter for which the probing bitmap is used (64 MB). */
const BITMAP_LIMIT = 1 << 26;

/**
 * The least residue w mod q with no offset ≡ w, by probing the membership bitmap; −1 when the probe
 * budget runs out (or every residue is covered).
 */
function probeFree(member: Uint8Array, q: number, budget: number): number {
  const D = member.length;
  let spent = 0;
  for (let w = 0; w < q; w++) {
    let x = w;
    while (x < D && member[x] === 0) x += q;
    if (x >= D) return w;
    spent += Math.ceil((x - w + 1) / q);
    if (spent > budget) return -1;
  }
  return -1;
}

/** Marks h mod q for all offsets (given by differences, integer path); returns residues covered (stops at q). */
function markInt(diffs: Int32Array, q: number, stamp: Int32Array, mark: number): number {
  let r = 0;
  let covered = 0;
  const k = diffs.length;
  for (let i = 0; i < k; i++) {
    const d = diffs[i]!;
    r += d < q ? d : d % q;
    if (r >= q) r -= q;
    if (stamp[r] !== mark) {
      stamp[r] = mark;
      if (++covered === q) break;
    }
  }
  return covered;
}

/** As {@link markInt} for diameters ≥ 2^31 (double arithmetic, exact below 2^53). */
function markFloat(diffs: Float64Array, q: number, stamp: Int32Array, mark: number): number {
  let r = 0;
  let covered = 0;
  for (let i = 0; i < diffs.length; i++) {
    const d = diffs[i]!;
    r += d < q ? d : d % q;
    if (r >= q) r -= q;
    if (stamp[r] !== mark) {
      stamp[r] = mark;
      if (++covered === q) break;
    }
  }
  return covered;
}
