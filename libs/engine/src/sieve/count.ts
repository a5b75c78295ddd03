// Reading a sieved segment: range masking, first/last set bits, pattern occurrences.
import type { CorePatternResult } from './core';
import type { CompiledPattern } from './pattern';
import { RESIDUES, WORD_BIT_VALUE, popcount32 } from './wheel30';

/** Clears the bits of the integers outside [a, b] among the bytes [0, L) that start at base. */
export function clearOutside(buf: Uint8Array, base: number, L: number, a: number, b: number): void {
  if (a > base) {
    const k = Math.floor((a - base) / 30);
    buf.fill(0, 0, Math.min(k, L));
    if (k < L) for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! < a) buf[k]! &= ~(1 << i);
  }
  if (b < base + 30 * L - 1) {
    const k = Math.floor((b - base) / 30);
    for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! > b) buf[k]! &= ~(1 << i);
    buf.fill(0, k + 1, L);
  }
}

/** Offset from the base of the lowest set bit in words [from, words) (there must be one). */
export function firstBitValue(u32: Uint32Array, from: number, words: number): number {
  for (let w = from; w < words; w++) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x & -x)]!;
  }
  return -1;
}

/** Offset from the base of the highest set bit in words [0, words) (there must be one). */
export function lastBitValue(u32: Uint32Array, words: number): number {
  for (let w = words - 1; w >= 0; w--) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x)]!;
  }
  return -1;
}

/** The twin-prime start bits of word w (starts 11, 17 at bits 2, 4 of a byte; 29 at bit 7). */
const twinBits = (u32: Uint32Array, w: number): number => {
  const P = u32[w]!;
  // 11 and 17 pair with the next bit of their byte; 29 with bit 0 of the next byte, which is the
  // next bit of the word except at bit 31.
  return P & ((P >>> 1) | (u32[w + 1]! << 31)) & 0x94949494;
};

/**
 * One pass over the words [0, words) counting the primes and the twin pairs that start there
 * (the first and last twin are located afterwards, so the loop has no bookkeeping). Returns the
 * number of primes; adds the twins to `twins`.
 */
export function countPrimesAndTwins(u32: Uint32Array, words: number, base: number, twins: CorePatternResult): number {
  let primes = 0;
  let count = 0;
  // Three words at a time: their nibble counts (≤ 4 each) add up to ≤ 12 before one reduction.
  let w = 0;
  for (; w + 3 <= words; w += 3) {
    const P0 = u32[w]!, P1 = u32[w + 1]!, P2 = u32[w + 2]!, P3 = u32[w + 3]!;
    let a = P0 - ((P0 >>> 1) & 0x55555555);
    let b = P1 - ((P1 >>> 1) & 0x55555555);
    let c = P2 - ((P2 >>> 1) & 0x55555555);
    a = (a & 0x33333333) + ((a >>> 2) & 0x33333333);
    b = (b & 0x33333333) + ((b >>> 2) & 0x33333333);
    c = (c & 0x33333333) + ((c >>> 2) & 0x33333333);
    let s = a + b + c;
    s = (s & 0x0f0f0f0f) + ((s >>> 4) & 0x0f0f0f0f);
    primes += Math.imul(s, 0x01010101) >>> 24;
    const o0 = P0 & ((P0 >>> 1) | (P1 << 31)) & 0x94949494;
    const o1 = P1 & ((P1 >>> 1) | (P2 << 31)) & 0x94949494;
    const o2 = P2 & ((P2 >>> 1) | (P3 << 31)) & 0x94949494;
    if ((o0 | o1 | o2) !== 0) count += popcount32(o0) + popcount32(o1) + popcount32(o2);
  }
  for (; w < words; w++) {
    const P = u32[w]!;
    primes += popcount32(P);
    const occ = P & ((P >>> 1) | (u32[w + 1]! << 31)) & 0x94949494;
    if (occ !== 0) count += popcount32(occ);
  }
  if (count > 0) {
    twins.count += count;
    if (twins.first < 0) {
      w = 0;
      while (twinBits(u32, w) === 0) w++;
      const occ = twinBits(u32, w);
      twins.first = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(occ & -occ)]!;
    }
    w = words - 1;
    while (twinBits(u32, w) === 0) w--;
    twins.last = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(twinBits(u32, w))]!;
  }
  return primes;
}

/**
 * Counts the occurrences of one pattern whose start n lies in the bytes [0, 4·words) of the segment,
 * and updates its first/last occurrence. Occurrence bits are built per 32-bit word: bit c of each
 * byte says that n = 30k + RESIDUES[c] starts an occurrence.
 */
export function countPattern(u32: Uint32Array, words: number, base: number, cp: CompiledPattern, out: CorePatternResult): void {
  let count = 0;
  let firstWord = -1;
  let firstBits = 0;
  let lastWord = -1;
  let lastBits = 0;
  if (cp.twin) {
    // Starts 11 and 17 (bits 2, 4) pair with the next bit of the byte; 29 (bit 7) with bit 0 of the
    // next byte, which is the next bit of the word except at bit 31.
    for (let w = 0; w < words; w++) {
      const P = u32[w]!;
      const occ = P & ((P >>> 1) | (u32[w + 1]! << 31)) & 0x94949494;
      if (occ !== 0) {
        count += popcount32(occ);
        if (firstWord < 0) {
          firstWord = w;
          firstBits = occ;
        }
        lastWord = w;
        lastBits = occ;
      }
    }
  } else {
    const nClasses = cp.classes.length;
    for (let w = 0; w < words; w++) {
      let occ = 0;
      for (let ci = 0; ci < nClasses; ci++) {
        const bytes = cp.termBytes[ci]!;
        const bits = cp.termBits[ci]!;
        let acc = -1;
        for (let t = 0; t < bytes.length; t++) {
          const d = bytes[t]!;
          const q = w + (d >> 2);
          const s = (d & 3) << 3;
          const v = s === 0 ? u32[q]! : (u32[q]! >>> s) | (u32[q + 1]! << (32 - s));
          acc &= v >>> bits[t]!;
          if ((acc & 0x01010101) === 0) break;
        }
        occ |= (acc & 0x01010101) << cp.classes[ci]!;
      }
      if (occ !== 0) {
        count += popcount32(occ);
        if (firstWord < 0) {
          firstWord = w;
          firstBits = occ;
        }
        lastWord = w;
        lastBits = occ;
      }
    }
  }
  if (count === 0) return;
  out.count += count;
  if (out.first < 0) out.first = base + 120 * firstWord + WORD_BIT_VALUE[31 - Math.clz32(firstBits & -firstBits)]!;
  out.last = base + 120 * lastWord + WORD_BIT_VALUE[31 - Math.clz32(lastBits)]!;
}
