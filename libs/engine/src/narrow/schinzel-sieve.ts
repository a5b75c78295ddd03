import { inputError } from '../errors';
import { CONSTRUCT_MAX_K } from './limits';
import { sieveInterval } from './interval-sieve';
import { narrowestWindow } from './narrowest-window';
import { narrowResult } from './narrow-result';
import type { NarrowTuple } from './types';

/**
 * Schinzel sieve: remove 1 mod 2 and 0 mod q for every odd prime q ≤ k from [−X, X]; the
 * survivors (±2^j·m, m free of primes ≤ k) are admissible by construction. X doubles until at
 * least k survive, then the narrowest window of k survivors is kept (so the result may sit off
 * centre, as in the shifted variant).
 * @throws EngineError(input) unless 1 ≤ k ≤ CONSTRUCT_MAX_K (50 000).
 */
export function schinzelSieveTuple(k: number): NarrowTuple {
  if (!Number.isSafeInteger(k) || k < 1 || k > CONSTRUCT_MAX_K) {
    throw inputError(`k must be an integer from 1 to ${CONSTRUCT_MAX_K}, got ${k}`);
  }
  if (k <= 2) return narrowResult(k === 1 ? [0] : [0, 2], 'schinzel');
  let x = Math.ceil(k * Math.log(k + 1));
  for (;;) {
    const { survivors } = sieveInterval({ from: -x, to: x, fixedBound: k, greedyUpTo: k });
    if (survivors.length >= 2 * k) {
      const { start } = narrowestWindow(survivors, k);
      return narrowResult(survivors.slice(start, start + k), 'schinzel');
    }
    x *= 2;
  }
}
