import { limitError } from '../errors';
import { primesUpTo } from '../primes/small-primes';
import { normalizeTuple } from '../tuple/normalize';
import { checkLevel, productTree } from '../wheel/primorial';

/** Work bound (offsets × primes to reduce) of {@link occurrenceCount}. */
export const OCCURRENCE_WORK_LIMIT = 5e8;

/**
 * Number of x in one period [1, p#] of wheel level p with x + h coprime to p# for every h in H
 * (H need not be consecutive): ∏_{q ≤ p} (q − ν_q(H)) by the Chinese remainder theorem. Zero
 * exactly when H is not admissible for some prime q ≤ p. Primes q above the diameter meet k distinct
 * residues, so only q ≤ min(p, diameter) are reduced explicitly.
 * @param values the tuple, any order (normalized first)
 * @param p the level, a prime ≤ 10^6
 * @throws EngineError(input) for an invalid tuple or level; EngineError(limit) when p > 10^6 or the
 *   reduction work k·π(min(p, diameter)) exceeds 5·10^8.
 */
export function occurrenceCount(values: ReadonlyArray<number | bigint | string>, p: number): bigint {
  checkLevel(p);
  const h = normalizeTuple(values);
  const k = h.length;
  const diameter = h[k - 1]!;
  const primes = primesUpTo(p);
  let explicit = 0;
  while (explicit < primes.length && primes[explicit]! <= diameter) explicit++;
  if (k * explicit > OCCURRENCE_WORK_LIMIT) {
    throw limitError(`occurrenceCount: ${k} offsets × ${explicit} primes exceeds the work limit ${OCCURRENCE_WORK_LIMIT}`);
  }
  const factors: bigint[] = [];
  const stamp = new Int32Array(explicit > 0 ? primes[explicit - 1]! + 1 : 1);
  for (let i = 0; i < explicit; i++) {
    const q = primes[i]!;
    let nu = 0;
    for (const x of h) {
      const r = x % q;
      if (stamp[r] !== i + 1) {
        stamp[r] = i + 1;
        nu++;
      }
    }
    if (nu === q) return 0n;
    factors.push(BigInt(q - nu));
  }
  for (let i = explicit; i < primes.length; i++) {
    const f = primes[i]! - k;
    if (f <= 0) return 0n;
    factors.push(BigInt(f));
  }
  return productTree(factors);
}
