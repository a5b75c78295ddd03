import { inputError } from '../errors';
import { isSmallPrime } from '../primes/small-primes';
import type { Offsets } from './normalize';

/** Least non-negative residue of a safe integer h modulo q. */
export function residue(h: number, q: number): number {
  const r = h % q;
  return r < 0 ? r + q : r;
}

/**
 * The residues modulo q covered by the tuple, in increasing order (ν_q(H) of them).
 * @throws EngineError(input) when q is not a prime below 2^31.
 */
export function coveredResidues(offsets: Offsets, q: number): number[] {
  checkPrime(q);
  if (q <= 1 << 20) {
    const seen = new Uint8Array(q);
    for (const h of offsets) seen[residue(h, q)] = 1;
    const out: number[] = [];
    for (let r = 0; r < q; r++) if (seen[r]) out.push(r);
    return out;
  }
  const set = new Set<number>();
  for (const h of offsets) set.add(residue(h, q));
  return Array.from(set).sort((a, b) => a - b);
}

/**
 * ν_q(H): the number of distinct residues modulo the prime q met by the offsets of H.
 * @throws EngineError(input) when q is not a prime below 2^31.
 */
export function occupancy(offsets: Offsets, q: number): number {
  return coveredResidues(offsets, q).length;
}

function checkPrime(q: number): void {
  if (!Number.isSafeInteger(q) || q >= 2 ** 31 || !isSmallPrime(q)) {
    throw inputError(`modulus ${q} is not a prime below 2^31`);
  }
}
