import { inputError } from '../errors';
import { sieveInterval, type TieBreak } from './interval-sieve';
import { narrowestWindow } from './narrowest-window';
import { narrowResult } from './narrow-result';
import type { NarrowTuple } from './types';

/** Options of {@link greedyGreedySieve}. */
export interface GreedyGreedyOptions {
  readonly from: number;
  readonly to: number;
  /** Odd primes q ≤ fixedBound are sieved at 0 mod q before the greedy phase (0: pure greedy). */
  readonly fixedBound: number;
  readonly tieBreak?: TieBreak;
  /** Keep only the narrowest k survivors (default: all survivors). */
  readonly k?: number;
}

/**
 * Greedy-greedy sieving of an interval: remove 1 mod 2 and 0 mod q for odd q ≤ fixedBound, then
 * the least occupied class (smallest residue on ties) for each further prime until the survivors
 * are admissible (see {@link sieveInterval}). The survivors form an admissible tuple; it is
 * returned shifted to start at 0, with its witness, and `origin` = its least element before shifting.
 * Anchor (Polymath8 narrow-tuple records, 2013): [−185662, 202456] with fixedBound between 137
 * and 397 (at least) leaves 34 429 survivors of diameter 388 118.
 * @throws EngineError(input) for a bad interval, or when fewer than k survive.
 */
export function greedyGreedySieve(options: GreedyGreedyOptions): NarrowTuple & { readonly origin: number } {
  const { survivors } = sieveInterval({
    from: options.from,
    to: options.to,
    fixedBound: options.fixedBound,
    tieBreak: options.tieBreak,
  });
  let chosen = survivors;
  if (options.k !== undefined) {
    if (survivors.length < options.k) {
      throw inputError(`only ${survivors.length} survivors in [${options.from}, ${options.to}], ${options.k} needed`);
    }
    const { start } = narrowestWindow(survivors, options.k);
    chosen = survivors.slice(start, start + options.k);
  }
  const method = options.fixedBound > 2 ? 'greedy-greedy' : 'greedy';
  return { ...narrowResult(chosen, method), origin: chosen[0] };
}
