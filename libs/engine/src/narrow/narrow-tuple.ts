import { inputError } from '../errors';
import { checkStop, type WorkHooks } from '../sieve/progress';
import { greedyGreedySieve } from './greedy-greedy';
import { hensleyRichardsTuple } from './hensley-richards';
import { improveTuple } from './improve-tuple';
import { EXACT_MAX_K, minimalDiameter } from './minimal-diameter';
import { NARROW_MAX_K } from './narrow-admissibility';
import { schinzelSieveTuple } from './schinzel-sieve';
import type { NarrowTuple } from './types';
import { CONSTRUCT_MAX_K } from './limits';

/** Result of {@link narrowTuple}: `exact` is true when the diameter is H(k) itself. */
export type NarrowTupleResult = NarrowTuple & { readonly exact: boolean };

export { CONSTRUCT_MAX_K } from './limits';

/**
 * The narrowest admissible k-tuple Cribra can produce: for k ≤ EXACT_MAX_K the exact H(k) by
 * {@link minimalDiameter}; above, an upper bound — the best of the Hensley–Richards tuple, the
 * Schinzel sieve and greedy-greedy sieving of centred intervals — after {@link improveTuple}.
 * Above EXACT_MAX_K, `hooks` are called between the constructions and between the greedy-greedy
 * sieves (coarse: one construction of a large k is one unit of work); the exact search reports
 * nothing.
 * @throws EngineError(input) unless 1 ≤ k ≤ CONSTRUCT_MAX_K; EngineError(limit) when
 *   `hooks.shouldStop` answers true.
 */
export function narrowTuple(k: number, hooks: WorkHooks = {}): NarrowTupleResult {
  if (!Number.isSafeInteger(k) || k < 1) throw inputError(`k must be a positive integer, got ${k}`);
  if (k > Math.min(CONSTRUCT_MAX_K, NARROW_MAX_K)) {
    throw inputError(`k = ${k} is above the construction limit ${CONSTRUCT_MAX_K}`);
  }
  if (k <= EXACT_MAX_K) return { ...minimalDiameter(k), exact: true };
  const what = `constructing a narrow admissible ${k}-tuple`;
  const stage = (fraction: number): void => {
    checkStop(hooks, what);
    hooks.onProgress?.(fraction, what);
  };
  const candidates: NarrowTuple[] = [schinzelSieveTuple(k)];
  candidates.push(greedyGreedyFor(k, (f) => stage(0.2 + 0.5 * f)));
  // Hensley–Richards never wins above a few thousand here and its search for m gets slow.
  if (k <= HR_MAX_K) candidates.push(hensleyRichardsTuple(k));
  stage(0.75);
  let best = candidates[0];
  for (const c of candidates) if (c.diameter < best.diameter) best = c;
  const improved = improveTuple(best.tuple);
  hooks.onProgress?.(1, what);
  return { ...(improved.diameter < best.diameter ? improved : best), exact: false };
}

const HR_MAX_K = 2_000;

/** Greedy-greedy over a centred interval sized so that about k survive (a few secant steps). */
function greedyGreedyFor(k: number, step: (fraction: number) => void): NarrowTuple {
  const fixedBound = Math.max(3, Math.round(Math.sqrt(k * Math.log(k))));
  let width = Math.ceil(k * Math.log(k) + k);
  let best: NarrowTuple | null = null;
  for (let i = 0; i < 6; i++) {
    step(i / 10);
    const half = Math.ceil(width / 2);
    const all = greedyGreedySieve({ from: -half, to: half, fixedBound });
    if (all.k >= k) {
      const cut = greedyGreedySieve({ from: -half, to: half, fixedBound, k });
      if (!best || cut.diameter < best.diameter) best = cut;
      if (all.k === k) break;
    }
    width = Math.ceil((width * k) / Math.max(1, all.k)) + (all.k < k ? 2 : -2);
  }
  // Slightly wider intervals often leave a narrower k-window (surplus survivors to choose from).
  for (const widen of [1.02, 1.04, 1.06]) {
    step(0.6 + (widen - 1) * 5);
    const half = Math.ceil((width * widen) / 2);
    const all = greedyGreedySieve({ from: -half, to: half, fixedBound });
    if (all.k < k) continue;
    const cut = greedyGreedySieve({ from: -half, to: half, fixedBound, k });
    if (!best || cut.diameter < best.diameter) best = cut;
  }
  for (let grow = 1.1; !best; grow *= 1.1) {
    step(0.95);
    const half = Math.ceil((width * grow) / 2);
    const all = greedyGreedySieve({ from: -half, to: half, fixedBound });
    if (all.k >= k) best = greedyGreedySieve({ from: -half, to: half, fixedBound, k });
  }
  return best;
}
