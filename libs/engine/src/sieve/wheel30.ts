// The mod-30 wheel used by the segmented sieve: one byte per 30 consecutive integers, one bit per
// residue coprime to 30 (bit i stands for 30·k + RESIDUES[i]).

/** Residues modulo 30 coprime to 30, in increasing order (bit i of a sieve byte is RESIDUES[i]). */
export const RESIDUES: readonly number[] = [1, 7, 11, 13, 17, 19, 23, 29];

/** For r in 0..29: the bit index of residue r, or −1 when gcd(r, 30) > 1. */
export const RESIDUE_BIT: Int8Array = (() => {
  const t = new Int8Array(30).fill(-1);
  RESIDUES.forEach((r, i) => (t[r] = i));
  return t;
})();

/** Number of 1 bits of a 32-bit word. */
export function popcount32(x: number): number {
  x = x - ((x >>> 1) & 0x55555555);
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  x = (x + (x >>> 4)) & 0x0f0f0f0f;
  return Math.imul(x, 0x01010101) >>> 24;
}
