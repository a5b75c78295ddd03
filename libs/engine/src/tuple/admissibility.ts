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
  const diffs = new Float64Array(k);
  for (let i = 1; i < k; i++) diffs[i] = h[i]! - h[i - 1]!;
  const stamp = new Int32Array(primes[primes.length - 1]! + 1);
  for (let pi = 0; pi < primes.length; pi++) {
    const q = primes[pi]!;
    const mark = pi + 1;
    let r = 0;
    let covered = 0;
    for (let i = 0; i < k; i++) {
      const d = diffs[i]!;
      r += d < q ? d : d % q;
      if (r >= q) r -= q;
      if (stamp[r] !== mark) {
        stamp[r] = mark;
        if (++covered === q) break;
      }
    }
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
