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

// CLASS_STEP[8·r + c]: the least t ≥ 0 with r + t ≡ RESIDUES[c] (mod 30).
export const CLASS_STEP: Int32Array = (() => {
  const t = new Int32Array(240);
  for (let r = 0; r < 30; r++) for (let c = 0; c < 8; c++) t[8 * r + c] = (((RESIDUES[c]! - r) % 30) + 30) % 30;
  return t;
})();
// For p ≡ s (mod 30): PRODUCT_RESIDUE[8·s + c] = s·RESIDUES[c] mod 30, PRODUCT_MASK the byte mask clearing it.
export const PRODUCT_RESIDUE = new Int32Array(240);
export const PRODUCT_MASK = new Uint8Array(240);
for (let s = 0; s < 30; s++) {
  for (let c = 0; c < 8; c++) {
    const r = (s * RESIDUES[c]!) % 30;
    PRODUCT_RESIDUE[8 * s + c] = r;
    PRODUCT_MASK[8 * s + c] = RESIDUE_BIT[r]! >= 0 ? ~(1 << RESIDUE_BIT[r]!) & 0xff : 0xff;
  }
}

// Offset (from the segment base) of the integer of bit `pos` of a 32-bit word at word index 0.
export const WORD_BIT_VALUE: Int32Array = (() => {
  const t = new Int32Array(32);
  for (let pos = 0; pos < 32; pos++) t[pos] = 30 * (pos >> 3) + RESIDUES[pos & 7]!;
  return t;
})();


// The wheel of cofactors m coprime to 30: from m ≡ RESIDUES[w] the next one is DELTA[w] further.
export const DELTA = new Int32Array([6, 4, 2, 4, 2, 4, 6, 2]);
// For p ≡ s (mod 30) and p = 30q + s: the byte of p·m advances by q·DELTA[w] + BYTE_CARRY[8s + w].
export const BYTE_CARRY = new Int32Array(240);
for (let s = 0; s < 30; s++) {
  for (let w = 0; w < 8; w++) {
    const r = RESIDUES[w]!;
    BYTE_CARRY[8 * s + w] = Math.floor((s * (r + DELTA[w]!)) / 30) - Math.floor((s * r) / 30);
  }
}
// For r in 0..29: the least t ≥ 0 with r + t coprime to 30, and the wheel index of r + t.
export const TO_WHEEL_STEP = new Int32Array(30);
export const TO_WHEEL_INDEX = new Int32Array(30);
for (let r = 0; r < 30; r++) {
  let t = 0;
  while (RESIDUE_BIT[(r + t) % 30]! < 0) t++;
  TO_WHEEL_STEP[r] = t;
  TO_WHEEL_INDEX[r] = RESIDUE_BIT[(r + t) % 30]!;
}

/**
 * The cofactor of the first multiple of p to cross off at or after `base`: ⌈max(p², base) / p⌉,
 * exact for values below 2^53 (the floating-point quotient is corrected by its remainder).
 */
export function firstCofactor(p: number, base: number): number {
  const start = p * p > base ? p * p : base;
  let q = Math.floor(start / p);
  let rem = start - q * p;
  if (rem < 0) {
    q--;
    rem += p;
  } else if (rem >= p) {
    q++;
    rem -= p;
  }
  return rem === 0 ? q : q + 1;
}
