import { inputError } from '../errors';
import { CONSTRUCT_MAX_K } from './limits';
import { primesUpTo } from '../primes';
import { narrowAdmissibility } from './narrow-admissibility';
import { narrowResult } from './narrow-result';
import type { NarrowTuple } from './types';

/**
 * Hensley–Richards tuple {−p_{m+⌊k/2⌋−1}, …, −p_{m+1}, −1, 1, p_{m+1}, …, p_{m+⌈k/2⌉−1}} (p_1 = 2),
 * with the least m ≥ 1 that makes it admissible (Hensley & Richards 1973). For k ≤ 2 the
 * tuple is {0, 2} / {0}. Cost: one admissibility test per m, most fail at a small prime.
 * @throws EngineError(input) unless 1 ≤ k ≤ CONSTRUCT_MAX_K (50 000).
 */
export function hensleyRichardsTuple(k: number): NarrowTuple {
  if (!Number.isSafeInteger(k) || k < 1 || k > CONSTRUCT_MAX_K) {
    throw inputError(`k must be an integer from 1 to ${CONSTRUCT_MAX_K}, got ${k}`);
  }
  if (k <= 2) return narrowResult(k === 1 ? [0] : [0, 2], 'hensley-richards');
  const left = Math.floor(k / 2) - 1;
  const right = Math.ceil(k / 2) - 1;
  let bound = Math.max(100, Math.ceil(4 * k * Math.log(k)));
  let primes = primesUpTo(bound);
  for (let m = 1; ; m++) {
    while (m + Math.max(left, right) > primes.length) primes = primesUpTo((bound *= 2));
    const neg = Array.from(primes.subarray(m, m + left), (p) => -p).reverse();
    const pos = Array.from(primes.subarray(m, m + right));
    const tuple = [...neg, -1, 1, ...pos];
    if (narrowAdmissibility(tuple).admissible) return narrowResult(tuple, 'hensley-richards');
  }
}
