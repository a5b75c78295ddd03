import { narrowAdmissibility } from './narrow-admissibility';
import type { NarrowMethod, NarrowTuple } from './types';

/**
 * Package a sorted admissible set as a {@link NarrowTuple} shifted to start at 0, re-checking
 * admissibility (every reported result carries a freshly computed witness).
 * @throws Error when the set is not admissible (a construction bug, never a user error).
 */
export function narrowResult(sorted: readonly number[], method: NarrowMethod): NarrowTuple {
  const base = sorted[0];
  const tuple = sorted.map((x) => x - base);
  const check = narrowAdmissibility(tuple);
  if (!check.admissible) {
    throw new Error(`internal: ${method} construction is not admissible (prime ${check.prime} covered)`);
  }
  return { k: tuple.length, diameter: tuple[tuple.length - 1], tuple, witness: check.witness, method };
}
