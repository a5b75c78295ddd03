/**
 * For each prime q ≤ k, one residue class modulo q that the tuple leaves uncovered
 * (keys are the primes, values the residues in [0, q)).
 */
export type ResidueWitness = Record<number, number>;

/** How a narrow tuple was obtained. */
export type NarrowMethod =
  | 'exhaustive'
  | 'greedy-greedy'
  | 'greedy'
  | 'schinzel'
  | 'hensley-richards'
  | 'improved'
  | 'local-search';

/**
 * An admissible k-tuple with its diameter and its admissibility witness.
 * Offsets are sorted increasingly; they are plain numbers because every construction here
 * stays far below 2^53 (diameters are O(k log k) and k is limited to 10^6).
 */
export interface NarrowTuple {
  readonly k: number;
  readonly diameter: number;
  readonly tuple: readonly number[];
  readonly witness: ResidueWitness;
  readonly method: NarrowMethod;
}
