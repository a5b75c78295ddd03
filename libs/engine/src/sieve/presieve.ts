import { RESIDUES } from './wheel30';

/** Primes removed by copying a precomputed pattern instead of crossing off (besides 2, 3, 5). */
export const PRESIEVE_PRIMES: readonly number[] = [7, 11, 13, 17, 19];
/** Period of the pattern in sieve bytes: 7·11·13·17·19 (each byte spans 30 integers). */
export const PRESIEVE_PERIOD = 7 * 11 * 13 * 17 * 19;

let cache: Uint8Array | null = null;

/**
 * The pre-sieved pattern: byte K has bit i set when 30K + RESIDUES[i] is divisible by none of
 * PRESIEVE_PRIMES. It is periodic with period PRESIEVE_PERIOD and is stored with at least `extra`
 * further bytes so that any window of `extra` bytes is one contiguous copy.
 */
export function presievePattern(extra: number): Uint8Array {
  if (cache && cache.length >= PRESIEVE_PERIOD + extra) return cache;
  const length = PRESIEVE_PERIOD + Math.max(extra, 1 << 16);
  const pattern = new Uint8Array(length);
  pattern.fill(0xff, 0, PRESIEVE_PERIOD);
  for (const p of PRESIEVE_PRIMES) {
    for (let i = 0; i < 8; i++) {
      // 30K + r ≡ 0 (mod p): the first such K, then every p-th byte.
      const r = RESIDUES[i]!;
      let k0 = 0;
      while ((30 * k0 + r) % p !== 0) k0++;
      const clear = ~(1 << i) & 0xff;
      for (let k = k0; k < PRESIEVE_PERIOD; k += p) pattern[k]! &= clear;
    }
  }
  for (let k = PRESIEVE_PERIOD; k < length; k++) pattern[k] = pattern[k - PRESIEVE_PERIOD]!;
  cache = pattern;
  return pattern;
}
